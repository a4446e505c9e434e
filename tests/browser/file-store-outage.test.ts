// A buyer on a server whose file store does not answer: adding a drawing says so in words beside
// the uploader and keeps the files already attached; following a file's link shows a short
// plain message, not an error page.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Spec, User } from "~/models/index.server";
import { freePort } from "../../db/cluster";
import { ownDraft, pdf, postAttachments, uploadForm } from "../support/attachment-files";
import { SCREENSHOTS, browserAppForFile, openHydrated, signedInPage, startBrowserApp } from "../support/browser";
import { startHttpApp } from "../support/http-app";

let buyer: User;
let spec: Spec;
let fileUrl: string;

beforeAll(async () => {
  const draft = await ownDraft();
  buyer = draft.buyer;
  spec = draft.spec;
  // One drawing stored while the store still answers (through this process).
  const stored = await postAttachments(draft.owner, spec.id, uploadForm(pdf("deck frame.pdf")));
  expect(stored.status).toBe(200);
  fileUrl = stored.data.attachments[0].downloadUrl;
});
// The served app's store is an address where nothing listens.
const app = browserAppForFile(async () => startBrowserApp(await startHttpApp({ S3_ENDPOINT: `http://127.0.0.1:${await freePort()}` })));

describe("the file store is down", () => {
  it("tells the buyer why a drawing was not attached, and what a file link cannot send", { timeout: 90_000 }, async () => {
    const page = await signedInPage(app, buyer.email, (url) => url.pathname !== "/sign-in");
    await openHydrated(page, `/specs/${spec.id}/edit/quotation`);

    await page.locator("[data-enhanced]").waitFor(); // the uploader is a chunk of its own: hydrated once it is there
    await page.getByLabel("Drawings and photos").setInputFiles({ name: "layout.pdf", mimeType: "application/pdf", buffer: Buffer.from("%PDF-1.7\n%%EOF\n") });
    const problem = page.getByText(/cannot reach its file store just now/);
    await expect.poll(() => problem.count(), { timeout: 15_000 }).toBeGreaterThan(0);
    expect(await problem.first().innerText()).toMatch(/Nothing was attached; please try again in a few minutes/);
    expect(await page.getByRole("link", { name: "deck frame.pdf" }).count()).toBe(1);
    expect(await page.getByRole("link", { name: "layout.pdf" }).count()).toBe(0);
    await page.getByText("Drawings and photos").first().scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(SCREENSHOTS, "file-store-down-upload.png") });

    const response = await page.goto(fileUrl);
    expect(response?.status()).toBe(503);
    expect(await page.locator("body").innerText()).toBe("Tenderflow cannot reach its file store just now. Please try again in a few minutes.");
    await page.screenshot({ path: path.join(SCREENSHOTS, "file-store-down-download.png") });
  });
});
