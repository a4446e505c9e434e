// Forms as a keyboard and a browser without JavaScript use them. Enter in a price of the bid form
// saves the bid (the browser presses the form's first submit button, which once was "Add a line of
// your own"); and the buyer's handover problem and a shop's question, refused and then sent, with
// scripts switched off.
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Bid, JobEvent, JobFile, SpecQuestion, type Job, type Spec, type User } from "~/models/index.server";
import { reachMilestones } from "~/services/job-progress.server";
import { PASSWORD, makeJob, makeMember, makePublishedSpec } from "../support/factories";
import { fillOfferTerms } from "../support/bid-page";
import { SCREENSHOTS, hydrated, signInAs, startBrowserApp, type BrowserApp } from "../support/browser";
import { PNG_BYTES } from "../support/attachment-files";

let app: BrowserApp;
let buyer: User;
let shop: User;
let spec: Spec;
let job: Job;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Hollins Pressings" });
  shop = await makeMember("shop", { organisationName: "Ravenfold Hydraulics" });
  spec = await makePublishedSpec(buyer, { machine: { title: "Coining press, main ram" } });
  ({ job } = await makeJob(buyer, shop, { title: "Bending brake, back gauge" }));
  await reachMilestones(shop, job.id, { milestone: "handed_over", note: "Delivered and run in." });
  app = await startBrowserApp();
}, 180_000);
afterAll(async () => {
  await app?.close();
});

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `plain-forms-${name}.png`), fullPage: true });

describe("the bid form from the keyboard", () => {
  it("saves the draft when Enter is pressed in a price, and adds no line of the shop's own", { timeout: 180_000 }, async () => {
    const page = await app.newPage();
    await signInAs(page, shop.email, PASSWORD);
    await page.waitForURL("**/open-specs");
    await page.goto(`/specs/${spec.id}/bid`);
    await hydrated(page);
    const prices = page.locator('input[name$=".unitPrice"]');
    await expect.poll(() => prices.count(), { timeout: 30_000 }).toBeGreaterThan(3);
    for (let i = 0; i < (await prices.count()); i++) await prices.nth(i).fill("150");
    await fillOfferTerms(page, "9");
    await prices.first().press("Enter");

    await expect.poll(() => page.getByText("Draft saved.", { exact: false }).count(), { timeout: 30_000 }).toBe(1);
    const bid = await Bid.findOne({ where: { specId: spec.id, organisationId: shop.organisationId }, rejectOnEmpty: true });
    expect(bid.status).toBe("draft");
    expect(bid.ownLines ?? []).toEqual([]);
    expect(await page.getByLabel("Line 1: what it is").count()).toBe(0);
  });
});

describe("the handover problem without JavaScript", () => {
  it("comes back with the problem beside the photos and the note kept, then goes through", { timeout: 180_000 }, async () => {
    // Signed in with scripts on (the sign-in page is the same either way), then a browser without them.
    const signIn = await app.newPage();
    await signInAs(signIn, buyer.email, PASSWORD);
    await signIn.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
    const context = await app.browser.newContext({ baseURL: app.baseUrl, viewport: { width: 1280, height: 860 }, javaScriptEnabled: false });
    await context.addCookies(await signIn.context().cookies());
    const page = await context.newPage();

    await page.goto(`/jobs/${job.id}`);
    await page.getByText("Something is wrong: report a problem").click();
    const note = "The back gauge stops 2 mm short at every position.";
    await page.getByLabel("What is wrong").fill(note);
    await page.getByLabel(/^Photos/).setInputFiles({ name: "gauge.pdf", mimeType: "application/pdf", buffer: Buffer.from("%PDF-1.4\n% not a photo\n") });
    await page.getByRole("button", { name: "Report the problem" }).click();

    await expect.poll(() => page.locator("#problem-photos-error").textContent(), { timeout: 30_000 }).toMatch(/gauge\.pdf: a PDF can't go here/);
    expect(await page.getByLabel("What is wrong").inputValue()).toBe(note);
    await shot(page, "handover-problem-refused");
    expect(await JobEvent.count({ where: { jobId: job.id, kind: "handover_problem" } })).toBe(0);

    await page.getByLabel(/^Photos/).setInputFiles({ name: "gauge.png", mimeType: "image/png", buffer: Buffer.from(PNG_BYTES) });
    await page.getByRole("button", { name: "Report the problem" }).click();
    await expect.poll(() => page.getByText("Problem reported", { exact: false }).count(), { timeout: 30_000 }).toBeGreaterThan(0);
    expect(new URL(page.url()).pathname).toBe(`/jobs/${job.id}`);
    expect(await JobFile.count({ where: { jobId: job.id, kind: "problem_photo" } })).toBe(1);
    await shot(page, "handover-problem-sent");
    await context.close();
  });
});

describe("a shop's question without JavaScript", () => {
  it("comes back as the spec page with the problem beside the question, then is sent", { timeout: 180_000 }, async () => {
    const signIn = await app.newPage();
    await signInAs(signIn, shop.email, PASSWORD);
    await signIn.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
    const context = await app.browser.newContext({ baseURL: app.baseUrl, viewport: { width: 1280, height: 860 }, javaScriptEnabled: false });
    await context.addCookies(await signIn.context().cookies());
    const page = await context.newPage();

    await page.goto(`/specs/${spec.id}`);
    const box = page.getByLabel("Ask the machine builder");
    await box.fill("   ");
    await page.getByRole("button", { name: "Send the question" }).click();
    await expect.poll(() => page.getByText("Write your question first.").count(), { timeout: 30_000 }).toBe(1);
    expect(new URL(page.url()).pathname).toBe(`/specs/${spec.id}/questions`);
    await page
      .locator("#questions")
      .locator("xpath=..")
      .screenshot({ path: path.join(SCREENSHOTS, "plain-forms-question-refused.png") });

    const question = "May the power unit stand 8 m from the press?";
    await page.getByLabel("Ask the machine builder").fill(question);
    await page.getByRole("button", { name: "Send the question" }).click();
    await expect.poll(() => page.getByText("Question sent.", { exact: false }).count(), { timeout: 30_000 }).toBeGreaterThan(0);
    expect(new URL(page.url()).pathname).toBe(`/specs/${spec.id}`);
    expect(await SpecQuestion.count({ where: { specId: spec.id, body: question } })).toBe(1);
    await context.close();
  });
});
