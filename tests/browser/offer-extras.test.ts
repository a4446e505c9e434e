// A shop quotes the whole job in a real browser: the bill, the work beyond it, a line of its own,
// structured terms and its quotation as a PDF; the buyer sees them side by side with another
// shop's offer, what each leaves out, and downloads the PDF. Screenshots at desktop and phone size.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Bid, type Spec, type User } from "~/models/index.server";
import { BidDocument } from "~/models/bid.server";
import { bomOf, saveBid } from "~/services/bids.server";
import { inDays, makeMember, makePublishedSpec } from "../support/factories";
import { fillOfferTerms, priceEveryLine } from "../support/bid-page";
import { SCREENSHOTS, browserAppForFile, hydrated, openHydrated, signedInPage } from "../support/browser";

let buyer: User;
let shop: User;
let spec: Spec;

const PDF = Buffer.from("%PDF-1.4\n% Quotation Q-3107, Tarnside Hydraulics\n");

beforeAll(async () => {
  buyer = await makeMember("buyer", { organisationName: "Calder Forming Ltd" });
  shop = await makeMember("shop", { organisationName: "Tarnside Hydraulics" });
  spec = await makePublishedSpec(buyer, { machine: { title: "Trim press, main ram" } });
  // A rival offer: the bill only, no commissioning, delivered at the buyer's works.
  const rival = await makeMember("shop", { organisationName: "Moorgate Fluid Power" });
  const bom = await bomOf(spec);
  await saveBid(rival, spec.id, {
    intent: "submit",
    lines: bom.map((l) => ({ key: l.key, unitPrice: "210" })),
    leadTimeWeeks: 11,
    validUntil: inDays(40),
    extras: [
      { kind: "assembly", answer: "priced", price: "1600" },
      { kind: "documentation", answer: "included" },
    ],
    incoterm: "DAP",
    place: "Calder works",
    // The rest of the 20 % retainer, paid through the portal.
    onDeliveryPercent: 80,
    warrantyMonths: 18,
    alternativeDescription: "A servo-driven pump in place of the fixed pump and its motor: it runs only while the ram moves.",
    alternativeLines: [
      { name: "Servo motor and internal gear pump", quantity: 1, price: "5200" },
      { name: "Servo drive", quantity: 1, price: "1900" },
    ],
  });
});
const app = browserAppForFile();

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `offer-extras-${name}.png`), fullPage: true });

describe("an offer beyond the bill", () => {
  it("a shop quotes extras, terms and a PDF; the buyer sees them side by side", { timeout: 240_000 }, async () => {
    const page = await signedInPage(app, shop.email, "**/open-specs");
    await openHydrated(page, `/specs/${spec.id}/bid`);
    await priceEveryLine(page, 8, () => "200");

    // The work beyond the bill: assembly and commissioning priced, documentation included.
    const extra = (kind: string) => page.locator(`[data-extra="${kind}"]`);
    await extra("assembly").locator("select").selectOption("priced");
    await extra("assembly").locator('input[name$=".price"]').fill("1500");
    await extra("commissioning").locator("select").selectOption("priced");
    await extra("commissioning").locator('input[name$=".price"]').fill("1200");
    await extra("documentation").locator("select").selectOption("included");
    // A price only where the work is priced.
    expect(await extra("training").locator('input[name$=".price"]').isDisabled()).toBe(true);
    await page.getByRole("button", { name: "Add a line of your own" }).click();
    await page.getByLabel("Line 1: what it is").fill("Spare seal kit");
    await page.getByLabel("Line 1: price").fill("280");
    await fillOfferTerms(page, "12", { incoterm: "FCA", place: "Tarnside works" });
    // The live total adds the bill and the work beyond it.
    await expect.poll(() => page.getByTestId("offer-grand-total").textContent()).toMatch(/^£/);
    const grand = await page.getByTestId("offer-grand-total").textContent();
    await page.getByRole("button", { name: "Save as draft" }).click();
    await expect.poll(() => page.getByText("Draft saved.", { exact: false }).count()).toBe(1);
    // The draft holds what was typed.
    const draft = await Bid.findOne({ where: { specId: spec.id, organisationId: shop.organisationId }, rejectOnEmpty: true });
    expect(draft.extras.find((e) => e.kind === "commissioning")).toEqual({ kind: "commissioning", answer: "priced", priceCents: 120_000 });
    expect(draft.offerTerms).toMatchObject({ incoterm: "FCA", place: "Tarnside works" });

    // The quotation as a PDF.
    await page.locator('input[type="file"][name="files"]').setInputFiles({ name: "Quotation Q-3107.pdf", mimeType: "application/pdf", buffer: PDF });
    await page.getByRole("button", { name: "Attach to the offer" }).click();
    await expect.poll(() => page.getByTestId("offer-documents").textContent()).toContain("Quotation Q-3107.pdf");
    await hydrated(page);
    await page.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => page.getByText(/^Offer 1 sent/).count()).toBe(1);
    expect(await page.getByTestId("offer-grand-total").textContent()).toBe(grand);
    await shot(page, "1-shop-desktop");
    await page.setViewportSize({ width: 390, height: 844 });
    await expect.poll(() => page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, "2-shop-phone");
    // The parts beyond the bill on a phone, each card on its own.
    for (const [heading, name] of [
      ["Work beyond the bill", "2b-extras-phone"],
      ["Terms", "2c-terms-phone"],
      ["An alternative circuit (optional)", "2d-alternative-phone"],
    ]) {
      const card = page.getByRole("heading", { name: heading, exact: true }).locator("xpath=..");
      await card.screenshot({ path: path.join(SCREENSHOTS, `offer-extras-${name}.png`) });
    }

    const bid = await Bid.findOne({ where: { specId: spec.id, organisationId: shop.organisationId }, rejectOnEmpty: true });
    expect(bid.status).toBe("submitted");
    expect(bid.offerTerms).toMatchObject({ incoterm: "FCA", place: "Tarnside works", warrantyMonths: 12 });
    expect(bid.ownLines).toEqual([{ name: "Spare seal kit", priceCents: 28_000 }]);
    expect(await BidDocument.count({ where: { bidId: bid.id } })).toBe(1);

    // The buyer compares.
    const buyerPage = await signedInPage(app, buyer.email, "**/specs");
    await openHydrated(buyerPage, `/specs/${spec.id}/bids`);
    const comparison = buyerPage.getByTestId("comparison");
    await expect.poll(() => comparison.locator('[data-extra-row="commissioning"]').textContent()).toContain("£1,200.00");
    const cell = (term: string, shopName: string) =>
      comparison.locator(`td[data-offer-term="${term}"]`).nth(
        // Columns in total order; find the shop's by its header.
        shopName === "Tarnside Hydraulics" ? tarnside : 1 - tarnside,
      );
    const headers = await comparison.locator("thead th[data-bid]").allTextContents();
    const tarnside = headers.findIndex((h) => h.includes("Tarnside Hydraulics"));
    expect(tarnside).toBeGreaterThanOrEqual(0);
    expect(await cell("leaves-out", "Moorgate Fluid Power").textContent()).toContain("no commissioning on site offered");
    expect(await cell("delivery", "Tarnside Hydraulics").textContent()).toBe("FCA Tarnside works (Free Carrier, Incoterms 2020)");
    expect(await cell("delivery", "Moorgate Fluid Power").textContent()).toBe("DAP Calder works (Delivered at Place, Incoterms 2020)");
    expect(await cell("payment", "Moorgate Fluid Power").textContent()).toBe(
      "20 % with the order (the retainer, paid by card through Tenderflow), 80 % on delivery",
    );
    expect(await comparison.locator("[data-own-lines]").textContent()).toContain("Spare seal kit");
    const link = comparison.locator(`[data-documents="${bid.id}"] a`);
    expect(await link.textContent()).toBe("Quotation Q-3107.pdf");
    const download = await buyerPage.request.get((await link.getAttribute("href"))!);
    expect(download.status()).toBe(200);
    expect(Buffer.from(await download.body()).toString()).toBe(PDF.toString());
    // The rival's alternative circuit stands beside the offers, labelled, and does not take the cheapest mark.
    const alternative = buyerPage.locator("[data-alternative-circuit]");
    expect(await alternative.getByText("Alternative circuit", { exact: true }).count()).toBe(1);
    expect(await alternative.textContent()).toContain("Moorgate Fluid Power");
    expect(await buyerPage.getByTestId("cheapest-summary").textContent()).toContain("Tarnside Hydraulics");
    await alternative.screenshot({ path: path.join(SCREENSHOTS, "offer-extras-3b-alternative.png") });
    await shot(buyerPage, "3-buyer-desktop");
    await buyerPage.setViewportSize({ width: 390, height: 844 });
    await expect.poll(() => buyerPage.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(buyerPage, "4-buyer-phone");
  });
});
