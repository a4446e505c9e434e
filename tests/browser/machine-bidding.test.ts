// A machine of two axes in a real browser: a shop reads the machine on the spec page (each
// axis, the one power unit), prices its bill grouped by part, a second shop prices it too, and
// the buyer compares the offers part by part and awards one.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Bid, Job, type Spec, type User } from "~/models/index.server";
import { makeMember, makePublishedMachineSpec } from "../support/factories";
import { fillOfferTerms, openComparison } from "../support/bid-page";
import { SCREENSHOTS, browserAppForFile, hydrated, openHydrated, signedInPage } from "../support/browser";
import { clampAndPress } from "../support/machines";

const TITLE = "Clamp and press cell";
const machine = clampAndPress();
let buyer: User;
let shops: User[];
let spec: Spec;

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Ridgeway Forming Ltd" });
  shops = [await makeMember("shop", { organisationName: "Tamar Fluid Power" }), await makeMember("shop", { organisationName: "Oakfield Hydraulic Units" })];
  spec = await makePublishedMachineSpec(buyer, machine, { machine: { title: TITLE } });
});
const app = browserAppForFile();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `machine-bidding-${name}.png`), fullPage: true });

/** Opens the machine from the open specs, starts a bid and prices every line at `price`. */
async function priceMachine(page: Page, price: string, leadWeeks: string) {
  await page.goto("/open-specs");
  await page.getByRole("link", { name: TITLE }).click();
  await page.waitForURL(`**/specs/${spec.id}`);
  await page.getByRole("link", { name: "Start a bid" }).click();
  await page.waitForURL(`**/specs/${spec.id}/bid`);
  await hydrated(page);
  const prices = page.locator('input[name$=".unitPrice"]');
  await expect.poll(() => prices.count()).toBe(machine.bom.length);
  for (let i = 0; i < machine.bom.length; i++) await prices.nth(i).fill(price);
  await fillOfferTerms(page, leadWeeks);
}

describe("bidding on a machine", () => {
  it("a shop reads and prices a two-axis machine, the buyer compares part by part and awards", { timeout: 240_000 }, async () => {
    const first = await signedInPage(app, shops[0].email, "**/open-specs");
    await openHydrated(first, `/specs/${spec.id}`);
    // The machine as a shop reads it: each axis under its name, the power unit once.
    for (const name of ["Clamp", "Press"]) expect(await first.locator(`[data-axis="${name}"]`).count()).toBe(1);
    expect(await first.locator("[data-power-unit]").count()).toBe(1);
    expect(await first.locator("[data-machine-sequence] li").count()).toBe(machine.sequence.length);
    await shot(first, "1-spec-page");
    // On a phone the machine reads without the page scrolling sideways (wide tables scroll in their own box).
    await first.setViewportSize({ width: 390, height: 844 });
    await expect.poll(() => first.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await first.locator('[data-axis="Press"]').screenshot({ path: path.join(SCREENSHOTS, "machine-bidding-1b-axis-390.png") });
    await first.locator("[data-power-unit]").screenshot({ path: path.join(SCREENSHOTS, "machine-bidding-1c-power-unit-390.png") });
    await first.setViewportSize({ width: 1280, height: 720 });

    await priceMachine(first, "250", "14");
    // The bill is grouped: the power unit first, then each axis.
    expect(await first.locator("[data-bill-group]").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-bill-group")))).toEqual([
      "Power unit",
      "Clamp",
      "Press",
    ]);
    await expect.poll(() => first.getByTestId("offer-total").textContent()).not.toBe("£0.00");
    await shot(first, "2-shop-form");
    await first.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => first.getByText(/^Offer 1 sent/).count()).toBe(1);

    const second = await signedInPage(app, shops[1].email, "**/open-specs");
    await priceMachine(second, "200", "16");
    await second.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => second.getByText(/^Offer 1 sent/).count()).toBe(1);
    const stored = await Bid.findAll({ where: { specId: spec.id } });
    expect(stored.map((b) => b.lines.map((l) => l.key))).toEqual([machine.bom.map((l) => l.key), machine.bom.map((l) => l.key)]);

    // The buyer compares: each line says what it serves, and each part has its subtotal per offer.
    const buyerPage = await signedInPage(app, buyer.email, "**/specs");
    await openComparison(buyerPage, spec.id);
    const comparison = buyerPage.getByTestId("comparison");
    // Under load the address can change before the comparison has rendered: wait for its lines.
    await expect.poll(() => comparison.locator("[data-serves]").count()).toBe(machine.bom.length);
    expect(await comparison.locator("[data-subtotal]").evaluateAll((rows) => rows.map((r) => r.getAttribute("data-subtotal")))).toEqual([
      "Power unit",
      "Clamp",
      "Press",
    ]);
    await expect.poll(() => buyerPage.getByTestId("cheapest-summary").textContent()).toContain("Oakfield Hydraulic Units");
    await shot(buyerPage, "3-comparison");

    await buyerPage.getByRole("link", { name: "Award to Oakfield Hydraulic Units" }).click();
    await buyerPage.getByText("I award this spec to Oakfield Hydraulic Units.").click();
    await buyerPage.getByRole("button", { name: "Confirm the award" }).click();
    await buyerPage.waitForURL("**/jobs/*");
    const job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(job.shopOrganisationId).toBe(shops[1].organisationId);
    await shot(buyerPage, "4-job");
  });
});
