// A published spec in a real browser: the bill and the calculation trail are not in the page
// until opened; one click loads each (a fetcher), and without JavaScript a link loads the page
// with it open.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Spec, User } from "~/models/index.server";
import { PASSWORD, makeMember, makePublishedSpec } from "../support/factories";
import { SCREENSHOTS, browserAppForFile, openHydrated, signedInPage } from "../support/browser";

let buyer: User;
let spec: Spec;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Fernhill Presswork" });
  spec = await makePublishedSpec(buyer, { machine: { title: "Trim press, main ram" } });
});
const app = browserAppForFile();

const signedInHome = (url: URL) => !url.pathname.startsWith("/sign-in");

describe("a published spec's long detail", () => {
  it("loads the trail and the bill when opened", { timeout: 120_000 }, async () => {
    const page = await signedInPage(app, buyer.email, signedInHome);
    await openHydrated(page, `/specs/${spec.id}`);
    await page.screenshot({ path: path.join(SCREENSHOTS, "published-detail-page.png"), fullPage: true });
    expect(await page.locator("[data-trail-row]").count()).toBe(0);
    expect(await page.locator("[data-bom-key]").count()).toBe(0);

    await page.getByRole("link", { name: "How every number was reached" }).click();
    const trail = page.locator("details#calculation-trail");
    await expect.poll(() => trail.locator("[data-trail-row]").count(), { timeout: 15_000 }).toBeGreaterThan(20);
    expect(await trail.evaluate((d) => (d as HTMLDetailsElement).open)).toBe(true);
    await trail.screenshot({ path: path.join(SCREENSHOTS, "published-detail-trail.png") });

    await page.locator("details#bill summary").click();
    await expect.poll(() => page.locator("details#bill [data-bom-key]").count(), { timeout: 15_000 }).toBeGreaterThan(5);
    await page.locator("details#bill").screenshot({ path: path.join(SCREENSHOTS, "published-detail-bill.png") });
    await page.context().close();
  });

  it("without JavaScript, the link in a folded section opens the page with it", { timeout: 60_000 }, async () => {
    const context = await app.browser.newContext({ baseURL: app.baseUrl, javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto("/sign-in");
    await page.getByLabel("E-mail address").fill(buyer.email);
    await page.getByLabel("Password").fill(PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL(signedInHome);
    await page.goto(`/specs/${spec.id}`);
    await page.locator("details#calculation-trail summary").click();
    await page.getByRole("link", { name: "Show how every number was reached" }).click();
    await expect.poll(() => page.locator("details#calculation-trail[open] [data-trail-row]").count()).toBeGreaterThan(20);
    await context.close();
  });
});
