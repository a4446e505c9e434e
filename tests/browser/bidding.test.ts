// The bidding journey in a real browser: two shops price the same bill, the buyer compares the
// offers side by side and awards the cheapest complete one, the account manager sees the job.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Bid, Job, type Spec, type User } from "~/models/index.server";
import { makeMember, makePublishedSpec } from "../support/factories";
import { makeManagerOf } from "../support/parties";
import { fillOfferTerms, openComparison, priceEveryLine } from "../support/bid-page";
import { SCREENSHOTS, hydrated, browserAppForFile, signedInPage } from "../support/browser";

let buyer: User;
let shops: User[];
let manager: User;
let spec: Spec;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Harrow Press Works" });
  shops = [await makeMember("shop", { organisationName: "Quayside Hydraulics" }), await makeMember("shop", { organisationName: "Fenwick Power Units" })];
  manager = await makeManagerOf(buyer);
  spec = await makePublishedSpec(buyer, { machine: { title: "Forming press, main ram" } });
});
const app = browserAppForFile();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `bidding-${name}.png`), fullPage: true });

/** Prices every line at `price`, the first line at `first`, and submits. */
async function bid(page: Page, first: string, price: string, leadWeeks: string, alternative?: string, includedLine?: number) {
  await page.goto("/open-specs");
  await page.getByRole("link", { name: "Forming press, main ram" }).click();
  await page.waitForURL(`**/specs/${spec.id}`);
  await page.getByRole("link", { name: "Start a bid" }).click();
  await page.waitForURL(`**/specs/${spec.id}/bid`);
  await hydrated(page);
  // A line priced 0 is included elsewhere in the offer.
  const count = await priceEveryLine(page, 8, (i) => (i === 0 ? first : i === includedLine ? "0" : price));
  if (alternative) {
    await page.getByRole("checkbox", { name: "Alternative" }).nth(1).check();
    await page.getByPlaceholder("Make, model and why").fill(alternative);
  }
  await fillOfferTerms(page, leadWeeks);
  return count;
}

describe("bidding", () => {
  it("two shops bid, the buyer compares and awards, the account manager sees the job", { timeout: 180_000 }, async () => {
    // Shop 1: dearer overall. The live total follows the prices as they are typed.
    const first = await signedInPage(app, shops[0].email, "**/open-specs");
    const lines = await bid(first, "1500", "200", "12", undefined, 2);
    await expect.poll(() => first.getByTestId("offer-total").textContent()).not.toBe("£0.00");
    await shot(first, "1-shop-form");
    // On a phone the bill's table scrolls in its own box; the form around it never widens the page.
    await first.setViewportSize({ width: 390, height: 844 });
    expect(await first.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    // The line's column stays put while the table scrolls; it must not cover the price beside it.
    const price = first.locator('input[name$=".unitPrice"]').first();
    await price.scrollIntoViewIfNeeded();
    const priceBox = (await price.boundingBox())!;
    expect(priceBox.x + priceBox.width).toBeLessThanOrEqual(390);
    expect(priceBox.width).toBeGreaterThanOrEqual(96);
    expect(
      await first.evaluate(
        ([x, y]) => document.elementFromPoint(x, y)?.getAttribute("name") ?? "",
        [priceBox.x + priceBox.width / 2, priceBox.y + priceBox.height / 2],
      ),
    ).toMatch(/\.unitPrice$/);
    await first.setViewportSize({ width: 1280, height: 860 });
    await first.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => first.getByText(/^Offer 1 sent/).count()).toBe(1);
    await shot(first, "2-shop-sent");

    // Shop 2: cheaper, with one alternative part.
    const second = await signedInPage(app, shops[1].email, "**/open-specs");
    await bid(second, "1400", "150", "10", "Quieter internal gear pump, same displacement");
    await second.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => second.getByText(/^Offer 1 sent/).count()).toBe(1);

    const [dear, cheap] = [shops[0], shops[1]].map((s) => s.organisationId);
    const stored = await Bid.findAll({ where: { specId: spec.id } });
    expect(stored.find((b) => b.organisationId === cheap)!.totalCents).toBeLessThan(stored.find((b) => b.organisationId === dear)!.totalCents);
    expect(stored.every((b) => b.lines.length === lines && b.status === "submitted")).toBe(true);

    // The buyer: the cheapest complete offer stands out before reading a single number.
    const buyerPage = await signedInPage(app, buyer.email, "**/specs");
    await openComparison(buyerPage, spec.id);
    const summary = buyerPage.getByTestId("cheapest-summary");
    await expect.poll(() => summary.textContent()).toContain("Fenwick Power Units");
    expect(await buyerPage.getByText("Cheapest complete", { exact: true }).count()).toBe(1);
    expect(await buyerPage.getByText("Alternative", { exact: true }).count()).toBe(1);
    // The included line reads as included, not as the cheapest price of its row; each offer's terms sit beside its prices.
    const comparison = buyerPage.getByTestId("comparison");
    expect(await comparison.getByText("Included", { exact: false }).count()).toBe(1);
    const includedRow = comparison.locator("tbody tr").nth(2);
    expect(await includedRow.getByText("lowest", { exact: true }).count()).toBe(0);
    expect(await comparison.getByText("EXW Leeds works (Ex Works, Incoterms 2020)").count()).toBe(2);
    await shot(buyerPage, "3-comparison");
    // The decision is in view on a laptop screen without scrolling; on a phone the first offer's prices are in view beside the lines.
    await buyerPage.setViewportSize({ width: 1366, height: 768 });
    const awardCheapest = buyerPage.getByRole("link", { name: "Award the cheapest offer, Fenwick Power Units…" });
    const awardBox = await awardCheapest.boundingBox();
    expect(awardBox!.y + awardBox!.height).toBeLessThanOrEqual(768);
    await buyerPage.setViewportSize({ width: 390, height: 844 });
    const firstPrice = await comparison.locator("tbody tr").first().locator("td").first().boundingBox();
    expect(firstPrice!.x + firstPrice!.width).toBeLessThanOrEqual(390);
    await buyerPage.setViewportSize({ width: 1280, height: 860 });

    // A second tab has the other offer's confirmation open when the first tab awards.
    const secondTab = await buyerPage.context().newPage();
    await secondTab.goto(`/specs/${spec.id}/bids`);
    await hydrated(secondTab);
    await secondTab.getByRole("link", { name: "Award to Quayside Hydraulics" }).click();
    await secondTab.getByText("I award this spec to Quayside Hydraulics.").click();

    await buyerPage.getByRole("link", { name: "Award to Fenwick Power Units" }).click();
    await buyerPage.getByText("I award this spec to Fenwick Power Units.").click();
    await shot(buyerPage, "4-confirm");
    await buyerPage.getByRole("button", { name: "Confirm the award" }).click();
    await buyerPage.waitForURL("**/jobs/*");

    // The second tab's award is refused where the buyer is looking, and the page shows the spec awarded.
    await secondTab.getByRole("button", { name: "Confirm the award" }).click();
    const refusal = secondTab.locator("[data-refusal]", { hasText: "already been awarded" });
    await expect.poll(() => refusal.count()).toBe(1);
    await expect.poll(() => refusal.evaluate((el) => el === document.activeElement)).toBe(true);
    const box = (await refusal.boundingBox())!;
    const viewport = secondTab.viewportSize()!;
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y + box.height).toBeLessThanOrEqual(viewport.height);
    await expect.poll(() => secondTab.getByRole("heading", { level: 1 }).locator("..").textContent()).toContain("Awarded");
    expect(await secondTab.getByRole("link", { name: /^Award to/ }).count()).toBe(0);
    await shot(secondTab, "4b-second-tab-refused");
    await secondTab.close();
    const job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(job.shopOrganisationId).toBe(cheap);
    await shot(buyerPage, "5-job");

    // The account manager finds it among their accounts' jobs.
    const managerPage = await signedInPage(app, manager.email, "**/jobs");
    await expect.poll(() => managerPage.getByRole("link", { name: "Forming press, main ram" }).count()).toBeGreaterThan(0);
    await shot(managerPage, "6-manager-jobs");
    await managerPage.getByRole("link", { name: "Forming press, main ram" }).first().click();
    await managerPage.waitForURL(`**/jobs/${job.id}`);
    await shot(managerPage, "7-manager-job");
  });
});
