// The order confirmation: made by the award in its own transaction, numbered in our format, kept
// unchanged, shown to both parties and the account's staff (404 to anyone else), and drawn as a
// PDF whose text carries the number and the totals.
import { beforeAll, describe, expect, it } from "vitest";
import * as orderPage from "~/routes/job-order";
import * as orderPdfRoute from "~/routes/job-order.pdf";
import { Job, Organisation, OrderConfirmation, type User } from "~/models/index.server";
import type { OrderDocument } from "~/content/order-document";
import { formatMoney, retainerCents } from "~/content/money";
import { awardBid } from "~/services/award.server";
import { FieldErrors } from "~/services/errors.server";
import { orderPdf } from "~/services/order-pdf.server";
import { makeMember, makeOperatorUser, makePublishedSpec, makeSubmittedBid } from "../support/factories";
import { makeBuyerAndShop, makeManagerOf } from "../support/parties";
import { serverContext } from "../support/routes";
import { signedIn } from "../support/sessions";
import { pdfText } from "../support/pdf-text";

let buyer: User;
let shop: User;
let job: Job;
let order: OrderDocument;

beforeAll(async () => {
  ({ buyer, shop } = await makeBuyerAndShop({ buyer: "Kestrel Forming Ltd", shop: "Ironbridge Fluid Power" }));
  const spec = await makePublishedSpec(buyer, { machine: { title: "Scissor lift table, main cylinder" } });
  const bid = await makeSubmittedBid(spec, shop, { totalCents: 1_234_567, leadTimeWeeks: 10 });
  // The whole job quoted: commissioning priced, training included, a line of the shop's own.
  await bid.update({
    extras: [
      { kind: "commissioning", answer: "priced", priceCents: 150_000 },
      { kind: "training", answer: "included", priceCents: null },
    ],
    ownLines: [{ name: "Spare seal kit", priceCents: 25_000 }],
    totalCents: 1_234_567 + 150_000 + 25_000,
  });
  await Organisation.update(
    { address: "Unit 4, Forge Lane\nWalsall WS2 8LT", region: "UK, West Midlands", taxNumber: "GB 123 4567 89", quoteContactName: "Aled Price" },
    { where: { id: shop.organisationId } },
  );
  const loser = await makeMember("shop");
  await makeSubmittedBid(spec, loser, { totalCents: 999_999 });
  job = await awardBid(buyer, spec.id, { bidId: bid.id });
  order = (await OrderConfirmation.findOne({ where: { jobId: job.id }, rejectOnEmpty: true })).document;
});

describe("made at the award", () => {
  it("holds the spec and revision, both parties, the offer's lines, the retainer and the dates", () => {
    expect(order.number).toMatch(/^TF-\d{4}-\d{6}$/);
    expect(order.spec).toMatchObject({ title: "Scissor lift table, main cylinder", revision: 1 });
    expect(order.buyer.name).toBe("Kestrel Forming Ltd");
    expect(order.shop).toMatchObject({ name: "Ironbridge Fluid Power", region: "UK, West Midlands", taxNumber: "GB 123 4567 89", kind: "shop" });
    expect(order.awardedBy).toBe(buyer.name);
    expect(order.lines).toEqual([
      expect.objectContaining({ item: "Power unit", specification: "7.5 kW, 40 l tank", quantity: 1, unitPriceCents: 1_234_567, totalCents: 1_234_567 }),
    ]);
    expect(order.extras).toEqual([
      { name: "Commissioning on site", priceCents: 150_000 },
      { name: "Training", priceCents: null },
    ]);
    expect(order.ownLines).toEqual([{ name: "Spare seal kit", priceCents: 25_000 }]);
    expect(order.leavesOut).toContain("no wiring offered");
    expect(order.terms).toEqual(
      expect.arrayContaining([expect.stringMatching(/^Delivery: EXW Works/), expect.stringMatching(/^Payment: .*30 days after invoice/)]),
    );
    // The share with the order is the job's retainer, whatever the stored offer said: the two agree.
    const share = Number(job.retainerPercent);
    expect(order.terms).toContain(
      `Payment: ${share} % with the order (the retainer, paid by card through Tenderflow), ${100 - share} % 30 days after invoice.`,
    );
    expect(order.totalCents).toBe(1_409_567);
    expect(order.retainerCents).toBe(job.retainerCents);
    expect(order.retainerCents).toBe(retainerCents(1_409_567, job.retainerPercent));
    expect(order.balanceCents).toBe(1_409_567 - job.retainerCents);
    expect(order.leadTimeWeeks).toBe(10);
    expect(order.handoverBy).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });

  it("is kept as made: the database refuses to change it, and later changes to the parties leave it alone", async () => {
    const row = await OrderConfirmation.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    await expect(row.update({ number: "TF-1999-000001" })).rejects.toThrow(/not changed once made/);
    await Organisation.update({ name: "Ironbridge Renamed" }, { where: { id: shop.organisationId } });
    const again = await OrderConfirmation.findOne({ where: { jobId: job.id }, rejectOnEmpty: true });
    expect(again.document.shop.name).toBe("Ironbridge Fluid Power");
    expect(again.number).toBe(order.number);
  });

  it("numbers each award's order after the last, and a second award of the same spec (another tab) makes none", async () => {
    const spec = await makePublishedSpec(buyer);
    const bid = await makeSubmittedBid(spec, shop);
    const next = await awardBid(buyer, spec.id, { bidId: bid.id });
    const nextOrder = await OrderConfirmation.findOne({ where: { jobId: next.id }, rejectOnEmpty: true });
    expect(Number(nextOrder.number.slice(-6))).toBeGreaterThan(Number(order.number.slice(-6)));
    await expect(awardBid(buyer, spec.id, { bidId: bid.id })).rejects.toBeInstanceOf(FieldErrors);
    expect(await OrderConfirmation.count({ where: { jobId: next.id } })).toBe(1);
  });
});

describe("on screen and as a PDF", () => {
  it("shows the order to the buyer, the shop, the account's manager and admins; anyone else gets a 404", async () => {
    const manager = await makeManagerOf(buyer);
    for (const person of [buyer, shop, manager, await makeOperatorUser("admin")]) {
      const page = await (await signedIn(person)).get(orderPage.loader, `/jobs/${job.id}/order`, { jobId: job.id });
      expect(page.status, person.email).toBe(200);
      expect(page.data.order.number).toBe(order.number);
    }
    for (const stranger of [await makeMember("buyer"), await makeMember("shop"), await makeOperatorUser("account_manager")]) {
      const visitor = await signedIn(stranger);
      expect((await visitor.get(orderPage.loader, `/jobs/${job.id}/order`, { jobId: job.id })).status).toBe(404);
      expect((await visitor.get(orderPdfRoute.loader, `/jobs/${job.id}/order.pdf`, { jobId: job.id })).status).toBe(404);
    }
    const visitor = await signedIn(buyer);
    expect((await visitor.get(orderPage.loader, `/jobs/not-an-id/order`, { jobId: "not-an-id" })).status).toBe(404);
  });

  it("serves a PDF download named after the order", async () => {
    const visitor = await signedIn(shop);
    const response = (await orderPdfRoute.loader({
      request: visitor.request(`/jobs/${job.id}/order.pdf`),
      params: { jobId: job.id },
      context: serverContext(),
    } as never)) as Response;
    expect(response.status).toBe(200);
    expect(response.headers.get("Content-Type")).toBe("application/pdf");
    expect(response.headers.get("Content-Disposition")).toContain(`${order.number} - Scissor lift table, main cylinder - order confirmation.pdf`);
    const bytes = new Uint8Array(await response.arrayBuffer());
    expect(Buffer.from(bytes.subarray(0, 5)).toString("latin1")).toBe("%PDF-");
    expect(Buffer.from(bytes).toString("latin1").trimEnd().endsWith("%%EOF")).toBe(true);
  });

  it("writes the order number, the parties and the totals as text, in the app's font, with letters beyond Latin-1", async () => {
    const text = pdfText(await orderPdf({ ...order, buyer: { ...order.buyer, name: "Łódź Prasy Sp. z o.o." } }, { compress: false }));
    expect(text).toContain("Order confirmation");
    expect(text).toContain(order.number);
    expect(text).toContain("Ironbridge Fluid Power");
    expect(text.replace(/\n/g, "")).toContain("Łódź Prasy Sp. z o.o.");
    for (const cents of [order.totalCents, order.retainerCents, order.balanceCents]) expect(text).toContain(formatMoney(cents, order.currency));
    for (const term of order.terms) expect(text.replace(/\n/g, " ")).toContain(term.split(" ").slice(0, 3).join(" "));
    expect(text).toContain("Spare seal kit");
    expect(text).toContain("GB 123 4567 89");
    const raw = Buffer.from(await orderPdf(order, { compress: false })).toString("latin1");
    expect(raw).toMatch(/\/BaseFont \/[A-Z]{6}\+OpenSans/);
  });
});
