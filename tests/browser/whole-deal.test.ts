// The whole deal in a real browser (issue 17): a shop quotes the whole job (work beyond the bill,
// structured terms) and attaches its quotation PDF; the buyer compares and awards; the order
// confirmation exists on screen and as a PDF; the retainer is paid; the shop hands over; the
// buyer accepts; the balance is paid by card; the account manager sees it all and the audit log
// has the award and the payments.
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { Job, Organisation, OrderConfirmation, type Spec, type User } from "~/models/index.server";
import { makeMember, makeOperatorUser, makePublishedSpec, makeSubmittedBid } from "../support/factories";
import { makeDealParties } from "../support/parties";
import { fillOfferTerms, priceEveryLine } from "../support/bid-page";
import { formatMoney } from "~/content/money";
import { fillCard, startBrowserAppWithCards } from "../support/card-page";
import { SCREENSHOTS, browserAppForFile, openHydrated, signedInPage } from "../support/browser";

let buyer: User;
let shop: User;
let manager: User;
let admin: User;
let spec: Spec;
const TITLE = "Bale press, main cylinder";
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);

beforeAll(async () => {
  ({ buyer, shop, manager } = await makeDealParties({ buyer: "Brackenfield Balers", shop: "Wyvern Fluid Power" }));
  admin = await makeOperatorUser("admin");
  await Organisation.update(
    { region: "UK, West Midlands", address: "Unit 7, Canal Side\nTipton DY4 0AB", taxNumber: "GB 987 6543 21" },
    { where: { id: shop.organisationId } },
  );
  spec = await makePublishedSpec(buyer, { machine: { title: TITLE } });
  // A second, dearer offer to compare against.
  await makeSubmittedBid(spec, await makeMember("shop", { organisationName: "Ferrybridge Hydraulics" }), { totalCents: 99_000_000 });
});
const app = browserAppForFile(startBrowserAppWithCards);

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOTS, `whole-deal-${name}.png`), fullPage: true });

async function payOnCardPage(page: Page, returnPattern: string) {
  await page.waitForURL(`${app.cards.url}/checkout/**`);
  await fillCard(page, "4242 4242 4242 4242");
  await page.waitForURL(returnPattern);
}

describe("the whole deal", () => {
  it("from a quote with extras, terms and a PDF to the balance paid and the audit log", { timeout: 300_000 }, async () => {
    // The shop quotes the whole job.
    const shopPage = await signedInPage(app, shop.email, "**/open-specs");
    await openHydrated(shopPage, `/specs/${spec.id}/bid`);
    await priceEveryLine(shopPage, 3, (i) => (i === 0 ? "2400" : "150"));
    await shopPage.getByLabel("Commissioning on site", { exact: true }).selectOption("priced");
    await shopPage.getByLabel("Price of commissioning on site").fill("1200");
    await shopPage.getByLabel("Training", { exact: true }).selectOption("included");
    await fillOfferTerms(shopPage, "9");
    await shopPage.getByRole("button", { name: "Submit the offer" }).click();
    await expect.poll(() => shopPage.getByRole("button", { name: "Attach to the offer" }).count()).toBe(1);
    await shopPage.getByLabel("Files to attach to your offer").setInputFiles({
      name: "Wyvern quotation Q-2291.pdf",
      mimeType: "application/pdf",
      buffer: Buffer.from("%PDF-1.4\n% Wyvern Fluid Power quotation Q-2291\n%%EOF\n"),
    });
    await shopPage.getByRole("button", { name: "Attach to the offer" }).click();
    await expect.poll(() => shopPage.getByText("Wyvern quotation Q-2291.pdf").count()).toBeGreaterThan(0);
    await shot(shopPage, "1-shop-offer");

    // The buyer compares and awards.
    const buyerPage = await signedInPage(app, buyer.email, "**/specs");
    await openHydrated(buyerPage, `/specs/${spec.id}/bids`);
    const comparison = buyerPage.getByTestId("comparison");
    await expect.poll(() => comparison.textContent()).toContain("Wyvern Fluid Power");
    expect(await buyerPage.getByText("Wyvern quotation Q-2291.pdf").count()).toBeGreaterThan(0);
    await shot(buyerPage, "2-comparison");
    await buyerPage.getByRole("link", { name: "Award to Wyvern Fluid Power" }).first().click();
    await buyerPage.getByText("I award this spec to Wyvern Fluid Power.").click();
    await buyerPage.getByRole("button", { name: "Confirm the award" }).click();
    await buyerPage.waitForURL("**/jobs/*");
    const job = await Job.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });

    // The order confirmation: on screen, printable, and as a PDF.
    await buyerPage.getByRole("link", { name: "Order confirmation" }).click();
    await buyerPage.waitForURL(`**/jobs/${job.id}/order`);
    const order = await OrderConfirmation.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    await expect.poll(() => buyerPage.getByText(order.number).count()).toBe(1);
    expect(await buyerPage.getByText("Commissioning on site").count()).toBe(1);
    expect(await buyerPage.getByText("Tax number: GB 987 6543 21").count()).toBe(1);
    await shot(buyerPage, "3-order");
    await buyerPage.emulateMedia({ media: "print" });
    expect(await buyerPage.getByRole("navigation", { name: "Main" }).first().isVisible()).toBe(false);
    expect(await buyerPage.getByRole("button", { name: "Print" }).isVisible()).toBe(false);
    await shot(buyerPage, "3b-order-print");
    await buyerPage.emulateMedia({ media: "screen" });
    const pdf = await buyerPage.request.get(`/jobs/${job.id}/order.pdf`);
    expect(pdf.headers()["content-type"]).toBe("application/pdf");
    expect((await pdf.body()).subarray(0, 5).toString("latin1")).toBe("%PDF-");

    // The retainer, by card.
    await openHydrated(buyerPage, `/jobs/${job.id}`);
    await buyerPage.getByRole("button", { name: /^Pay the retainer of/ }).click();
    await payOnCardPage(buyerPage, `**/jobs/${job.id}/payment?session_id=*`);
    await expect.poll(() => buyerPage.getByText(/the retainer of .* has been received/).count(), { timeout: 20_000 }).toBe(1);

    // The shop hands over: the handover panel's badge (the job's state line says "Awaiting the buyer's acceptance" too).
    await openHydrated(shopPage, `/jobs/${job.id}`);
    await shopPage.getByLabel("Reached up to and including").selectOption("handed_over");
    await shopPage.getByRole("button", { name: "Record as reached" }).click();
    await expect.poll(() => shopPage.getByText("Awaiting the buyer", { exact: true }).count()).toBe(1);
    await shot(shopPage, "4-shop-handed-over");

    // The buyer finds a problem and reports it with a photo; the shop sees it, puts it right, files
    // the pressure test certificate and hands over again.
    await openHydrated(buyerPage, `/jobs/${job.id}`);
    await buyerPage.getByText("Something is wrong: report a problem").click();
    await buyerPage.getByLabel("What is wrong").fill("The return filter's clogging indicator is missing.");
    await buyerPage.getByLabel(/^Photos/).setInputFiles({ name: "filter.png", mimeType: "image/png", buffer: Buffer.from(PNG) });
    await buyerPage.getByRole("button", { name: "Report the problem" }).click();
    await expect.poll(() => buyerPage.getByText("Problem reported", { exact: true }).count()).toBe(1);
    await openHydrated(shopPage, `/jobs/${job.id}`);
    await expect.poll(() => shopPage.getByText("The return filter's clogging indicator is missing.").count()).toBeGreaterThan(0);
    expect(await shopPage.getByRole("link", { name: "filter.png" }).count()).toBeGreaterThan(0);
    await shot(shopPage, "4b-shop-sees-problem");
    await shopPage.getByLabel("Files (up to 6 of 10 MB each)").setInputFiles({
      name: "pressure test 180 bar.pdf",
      mimeType: "application/pdf",
      buffer: Buffer.from("%PDF-1.4\n% pressure test certificate\n%%EOF\n"),
    });
    await shopPage.getByRole("button", { name: "Upload" }).click();
    await expect.poll(() => shopPage.getByRole("link", { name: "pressure test 180 bar.pdf" }).count()).toBe(1);
    await shopPage.getByLabel("Reached up to and including").selectOption("handed_over");
    await shopPage.getByRole("button", { name: "Record as reached" }).click();
    await expect.poll(() => shopPage.getByText("Awaiting the buyer", { exact: true }).count()).toBe(1);

    // The buyer accepts, then pays the balance by card.
    await openHydrated(buyerPage, `/jobs/${job.id}`);
    expect(await buyerPage.getByRole("link", { name: "pressure test 180 bar.pdf" }).count()).toBe(1);
    await shot(buyerPage, "5-buyer-handover");
    await buyerPage.getByRole("button", { name: "Accept the handover" }).click();
    await expect.poll(() => buyerPage.getByText("Closed: handover accepted").count()).toBe(1);
    const balance = job.totalCents - job.retainerCents;
    await buyerPage.getByRole("button", { name: /^Pay the balance of/ }).click();
    await payOnCardPage(buyerPage, `**/jobs/${job.id}/payment?session_id=*`);
    await expect.poll(() => buyerPage.getByText(/the balance of .* has been received/).count(), { timeout: 20_000 }).toBe(1);
    await shot(buyerPage, "6-balance-paid");
    await expect.poll(async () => (await job.reload()).balanceMethod).toBe("card");

    // The account manager sees the closed, fully paid job and both payments.
    const managerPage = await signedInPage(app, manager.email, "**/jobs");
    await openHydrated(managerPage, `/jobs/${job.id}`);
    await expect.poll(() => managerPage.getByText("Closed: handover accepted").count()).toBe(1);
    expect(await managerPage.getByText(/^Paid by card on/).count()).toBe(1);
    expect(await managerPage.getByText(`Balance ${formatMoney(balance, job.currency)}`).count()).toBe(1);
    await shot(managerPage, "7-manager-job");
    await managerPage.goto("/payments");
    await expect.poll(() => managerPage.getByRole("link", { name: TITLE }).count()).toBe(2);
    await shot(managerPage, "8-manager-payments");

    // The audit log has the award and both payments.
    const adminPage = await signedInPage(app, admin.email, "**/admin/**");
    await adminPage.goto("/admin/audit");
    await expect.poll(() => adminPage.getByText("Bid awarded", { exact: true }).count()).toBeGreaterThan(0);
    expect(await adminPage.getByText("Payment received", { exact: true }).count()).toBeGreaterThanOrEqual(2);
    await shot(adminPage, "9-audit");
  });
});
