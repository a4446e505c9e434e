// An offer beyond the bill on real PostgreSQL: the work a shop sells with a power unit, its own
// lines, structured terms and validity, an alternative circuit, what the buyer's comparison
// makes of them, and the bad input each is refused with (nothing saved, what was typed kept).
import { describe, expect, it } from "vitest";
import * as bidRoute from "~/routes/spec-bid";
import * as bidsRoute from "~/routes/spec-bids";
import { Bid, BidVersion } from "~/models/index.server";
import { bomOf } from "~/services/bids.server";
import { offerSummary } from "~/services/offer-summary";
import { checkRequestBounds } from "~/http/request-bounds.server";
import { addDays, todayUtc } from "~/content/dates";
import { EXTRA_KEYS, type ExtraKind } from "~/content/offer-terms";
import { makeMember, makePublishedSpec } from "../support/factories";
import { bidFields, postBid } from "../support/bid-form";
import { signedIn } from "../support/sessions";

/** The kinds of work as the form posts them: every kind, priced where a price is given. */
function extrasFields(answers: Partial<Record<ExtraKind, string>>) {
  const fields: Record<string, string> = {};
  EXTRA_KEYS.forEach((kind, i) => {
    const answer = answers[kind] ?? "not_offered";
    fields[`extras[${i}].kind`] = kind;
    const priced = answer !== "included" && answer !== "not_offered";
    fields[`extras[${i}].answer`] = priced ? "priced" : answer;
    if (priced) fields[`extras[${i}].price`] = answer;
  });
  return fields;
}

async function setting() {
  const buyer = await makeMember("buyer");
  const spec = await makePublishedSpec(buyer);
  return { buyer, spec, bom: await bomOf(spec) };
}

describe("an offer beyond the bill", () => {
  it("prices the work beyond the bill and the shop's own lines, states its terms, and the buyer compares like for like", async () => {
    const { buyer, spec, bom } = await setting();
    const full = await signedIn(await makeMember("shop", { organisationName: "Fullscope Hydraulics" }));
    const lean = await signedIn(await makeMember("shop", { organisationName: "Leanline Power" }));

    const sent = await postBid(full, spec.id, {
      intent: "submit",
      ...bidFields(bom, () => "100", { validUntil: "", validDays: "45", incoterm: "DAP", place: "Porto", onDeliveryPercent: "60" }),
      ...extrasFields({ assembly: "1,200", wiring: "included", commissioning: "1500.50", training: "600" }),
      "ownLines[0].name": "Spare seal kit",
      "ownLines[0].price": "280",
      "ownLines[1].name": "Site survey",
      "ownLines[1].price": "0",
      "ownLines[2].name": "",
      "ownLines[2].price": "",
    });
    expect(sent.data?.result?.error).toBeUndefined();
    expect(sent.status).toBe(302);
    const bid = await Bid.findOne({
      where: { specId: spec.id, organisationId: (await Bid.findOne({ where: { specId: spec.id } }))!.organisationId },
      rejectOnEmpty: true,
    });
    // The share with the order is the spec's retainer (20 %), not the shop's to set.
    expect(bid.offerTerms).toEqual({ incoterm: "DAP", place: "Porto", retainerPercent: 20, onDeliveryPercent: 60, balanceDays: 30, warrantyMonths: 12 });
    expect(bid.validUntil).toBe(addDays(todayUtc(), 45));
    expect(bid.ownLines).toEqual([
      { name: "Spare seal kit", priceCents: 28_000 },
      { name: "Site survey", priceCents: 0 },
    ]);
    expect(bid.extras.find((e) => e.kind === "commissioning")).toEqual({ kind: "commissioning", answer: "priced", priceCents: 150_050 });
    expect(bid.extras.find((e) => e.kind === "wiring")).toEqual({ kind: "wiring", answer: "included", priceCents: null });
    // Worked by hand: the bill is 100.00 a line × quantities × 2 units; the extras are
    // 1200 + 1500.50 + 600 = 3300.50 and the own lines 280, each once for the order.
    const bill = bom.reduce((sum, l) => sum + l.quantity * 10_000, 0) * 2;
    expect(bid.totalCents).toBe(bill + 330_050 + 28_000);
    const summary = offerSummary(bid, spec.retainerPercent);
    expect(summary.totals).toMatchObject({ billCents: bill, extrasCents: 330_050, ownLinesCents: 28_000, totalCents: bid.totalCents });
    expect(summary.termsText[1]).toBe(
      "Payment: 20 % with the order (the retainer, paid by card through Tenderflow), 60 % on delivery, 20 % 30 days after invoice.",
    );
    // The history keeps the whole offer, extras and terms included.
    const version = await BidVersion.findOne({ where: { bidId: bid.id }, rejectOnEmpty: true });
    expect(version.offer).toMatchObject({ extras: bid.extras, ownLines: bid.ownLines, offerTerms: bid.offerTerms, totalCents: bid.totalCents });

    // The form comes back as it was sent.
    const form = await full.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id });
    expect(form.data.defaults).toMatchObject({ incoterm: "DAP", place: "Porto", onDeliveryPercent: "60", balanceDays: "30" });
    expect(form.data.defaults.extras[5]).toEqual({ kind: "commissioning", answer: "priced", price: "1500.50" });
    expect(form.data.defaults.ownLines).toEqual([
      { name: "Spare seal kit", price: "280.00" },
      { name: "Site survey", price: "0.00" },
    ]);

    // A second shop: a dearer bill, assembly only, no commissioning.
    expect(
      (await postBid(lean, spec.id, { intent: "submit", ...bidFields(bom, () => "110"), ...extrasFields({ assembly: "900", wiring: "included" }) })).status,
    ).toBe(302);
    const compared = await (await signedIn(buyer)).get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    const columns = compared.data.comparison.columns as {
      shop: string;
      totalCents: number;
      likeForLikeCents: number;
      leavesOut: string[];
      delivery: string;
      cheapestComplete: boolean;
    }[];
    const byShop = Object.fromEntries(columns.map((c) => [c.shop, c]));
    // Like for like is the bill plus the work both cover (assembly, wiring): commissioning and
    // training, which only Fullscope offers, and its own lines stay out of the ranking.
    expect(byShop["Fullscope Hydraulics"].likeForLikeCents).toBe(bill + 120_000);
    expect(byShop["Leanline Power"].likeForLikeCents).toBe((bill / 100) * 110 + 90_000);
    expect(byShop["Fullscope Hydraulics"].cheapestComplete).toBe(true);
    expect(byShop["Leanline Power"].leavesOut).toContain("no commissioning on site offered");
    expect(byShop["Fullscope Hydraulics"].leavesOut).not.toContain("no commissioning on site offered");
    expect(byShop["Fullscope Hydraulics"].delivery).toBe("DAP Porto (Delivered at Place, Incoterms 2020)");
    expect(byShop["Leanline Power"].delivery).toBe("EXW Leeds works (Ex Works, Incoterms 2020)");
    // Each shop's company profile sits beside its offer.
    const profiles = Object.values(compared.data.profiles as Record<string, { name: string; kind: string }>);
    expect(profiles.map((p) => p.name).sort()).toEqual(["Fullscope Hydraulics", "Leanline Power"]);
    expect(profiles.every((p) => p.kind === "shop")).toBe(true);
    const commissioning = compared.data.comparison.extraRows.find((r: { kind: string }) => r.kind === "commissioning");
    expect(commissioning.common).toBe(false);
  });

  it("refuses bad terms and extras with a clear field error, saving nothing and keeping what was typed", async () => {
    const { spec, bom } = await setting();
    const shop = await signedIn(await makeMember("shop"));
    const refused = async (fields: Record<string, string>) => {
      const res = await postBid(shop, spec.id, { intent: "submit", ...bidFields(bom, () => "10"), ...fields });
      expect(res.status).toBe(400);
      expect(await Bid.count({ where: { specId: spec.id } })).toBe(0);
      return res.data.result as { error: Record<string, string[]>; initialValue: Record<string, unknown> };
    };

    const badCode = await refused({ incoterm: "FOT", place: "Hull" });
    expect(badCode.error.incoterm[0]).toBe("Choose one of the Incoterms 2020 rules: EXW, FCA, CPT, CIP, DAP, DPU, DDP, FAS, FOB, CFR, CIF.");
    expect(badCode.initialValue.place).toBe("Hull");

    expect((await refused({ validUntil: "2031-02-30" })).error.validUntil[0]).toBe("Enter a real date, e.g. 2026-09-30.");
    expect((await refused({ validDays: "30" })).error.validDays[0]).toBe("Give a date or a number of days, not both.");
    expect((await refused({ ...extrasFields({ freight: "-350" }) })).error["extras[4].price"][0]).toMatch(/can't be negative/);
    expect((await refused({ ...extrasFields({}), "extras[6].answer": "priced" })).error["extras[6].price"][0]).toBe(
      "Enter the price, or choose included or not offered.",
    );
    // A share with the order posted anyway is not the shop's to set: the retainer counts.
    expect((await refused({ retainerPercent: "0", onDeliveryPercent: "90" })).error.onDeliveryPercent[0]).toBe(
      "The retainer (20 %) and on delivery add up to 110 %; at most 80 % on delivery.",
    );
    expect((await refused({ incoterm: "", place: "" })).error.incoterm[0]).toBe("Choose the delivery terms (an Incoterms 2020 rule).");
    expect((await refused({ warrantyMonths: "" })).error.warrantyMonths[0]).toMatch(/warranty in months/);

    const tooMany: Record<string, string> = {};
    for (let i = 0; i < 11; i++) Object.assign(tooMany, { [`ownLines[${i}].name`]: `Line ${i}`, [`ownLines[${i}].price`]: "1" });
    expect((await refused(tooMany)).error.ownLines[0]).toBe("At most 10 lines of your own.");
    expect((await refused({ "ownLines[0].name": "Survey" })).error["ownLines[0].price"][0]).toBe("Enter the price (0 if included).");
  });

  it("starts every kind of work open and will not submit one left open; a draft may leave them open", async () => {
    const { spec, bom } = await setting();
    const shop = await signedIn(await makeMember("shop"));
    const fresh = await shop.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id });
    expect(fresh.data.defaults.extras.map((e: { answer: string }) => e.answer)).toEqual(EXTRA_KEYS.map(() => ""));

    // The form posts every kind; assembly answered, the rest left open.
    const open = { ...extrasFields({ assembly: "900" }) };
    for (let i = 1; i < EXTRA_KEYS.length; i++) open[`extras[${i}].answer`] = "";
    const submitted = await postBid(shop, spec.id, { intent: "submit", ...bidFields(bom, () => "10"), ...open });
    expect(submitted.status).toBe(400);
    const error = submitted.data.result.error as Record<string, string[]>;
    for (let i = 1; i < EXTRA_KEYS.length; i++) expect(error[`extras[${i}].answer`]).toEqual(["Choose priced, included or not offered before you submit."]);
    expect(error["extras[0].answer"]).toBeUndefined();
    expect(await Bid.count({ where: { specId: spec.id } })).toBe(0);
    // Kinds missing from the post altogether are refused too.
    const withoutTraining = Object.fromEntries(
      Object.entries(bidFields(bom, () => "10")).filter(([name]) => !name.startsWith(`extras[${EXTRA_KEYS.length - 1}]`)),
    );
    const partial = await postBid(shop, spec.id, { intent: "submit", ...withoutTraining });
    expect(partial.status).toBe(400);
    expect(partial.data.result.error.extras[0]).toMatch(/^Answer every kind of work beyond the bill \(7\) before you submit/);

    const draft = await postBid(shop, spec.id, { intent: "save", ...bidFields(bom, () => "10"), ...open });
    expect(draft.status).toBe(302);
    const saved = await Bid.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    expect(saved.extras).toEqual([{ kind: "assembly", answer: "priced", priceCents: 90_000 }]);
    const again = await shop.get(bidRoute.loader, `/specs/${spec.id}/bid`, { specId: spec.id });
    expect(again.data.defaults.extras.map((e: { answer: string }) => e.answer)).toEqual(["priced", ...EXTRA_KEYS.slice(1).map(() => "")]);
  });

  it("is refused before any route reads it when a field carries a NUL or comes twice", async () => {
    const { spec } = await setting();
    const send = (body: string) =>
      checkRequestBounds(
        new Request(`http://127.0.0.1:3000/specs/${spec.id}/bid`, { method: "POST", headers: { "Content-Type": "application/x-www-form-urlencoded" }, body }),
      );
    expect(await send("intent=submit&place=Hull%00&incoterm=FOB")).toMatchObject({ status: 400, message: expect.stringMatching(/NUL/) });
    expect(await send("intent=submit&incoterm=FOB&incoterm=EXW")).toMatchObject({ status: 400, message: expect.stringMatching(/more than once/) });
    expect(await send("intent=submit&incoterm=FOB&place=Hull")).toBeNull();
  });
});

describe("an alternative circuit", () => {
  it("is kept with the offer, priced on its own bill, shown beside it and never ranked like for like", async () => {
    const { buyer, spec, bom } = await setting();
    const proposer = await signedIn(await makeMember("shop", { organisationName: "Otherway Fluid Power" }));
    const plain = await signedIn(await makeMember("shop", { organisationName: "Plainline Hydraulics" }));

    const withoutDescription = await postBid(proposer, spec.id, {
      intent: "submit",
      ...bidFields(bom, () => "100"),
      "alternativeLines[0].name": "Load-sensing pump",
      "alternativeLines[0].quantity": "1",
      "alternativeLines[0].price": "4000",
    });
    expect(withoutDescription.status).toBe(400);
    expect(withoutDescription.data.result.error.alternativeDescription[0]).toMatch(/Describe the circuit/);
    const unpriced = await postBid(proposer, spec.id, {
      intent: "submit",
      ...bidFields(bom, () => "100"),
      alternativeDescription: "One load-sensing pump",
      "alternativeLines[0].name": "Load-sensing pump",
      "alternativeLines[0].quantity": "0",
    });
    expect(unpriced.data.result.error["alternativeLines[0].quantity"][0]).toBe("At least 1.");
    expect(unpriced.data.result.error["alternativeLines[0].price"][0]).toBe("Enter the unit price.");

    expect(
      (
        await postBid(proposer, spec.id, {
          intent: "submit",
          ...bidFields(bom, () => "100"),
          alternativeDescription: "One load-sensing pump and a proportional valve instead of the fixed pump and relief",
          "alternativeLines[0].name": "Load-sensing pump",
          "alternativeLines[0].quantity": "1",
          "alternativeLines[0].price": "4000",
          "alternativeLines[1].name": "Proportional valve",
          "alternativeLines[1].quantity": "2",
          "alternativeLines[1].price": "950.50",
        })
      ).status,
    ).toBe(302);
    const bid = await Bid.findOne({ where: { specId: spec.id }, rejectOnEmpty: true });
    // One set: 4000 + 2 × 950.50 = 5901.00; two units wanted: 11802.00.
    expect(bid.alternativeCircuit).toMatchObject({ setTotalCents: 590_100, totalCents: 1_180_200 });
    expect(bid.alternativeCircuit!.lines).toHaveLength(2);

    expect((await postBid(plain, spec.id, { intent: "submit", ...bidFields(bom, () => "90") })).status).toBe(302);
    const compared = await (await signedIn(buyer)).get(bidsRoute.loader, `/specs/${spec.id}/bids`, { specId: spec.id });
    const columns = compared.data.comparison.columns as { shop: string; alternativeCircuit: unknown; cheapestComplete: boolean; likeForLikeCents: number }[];
    const otherway = columns.find((c) => c.shop === "Otherway Fluid Power")!;
    // The alternative is far cheaper than any bill, yet the plain offer is the cheapest like for like.
    expect(otherway.alternativeCircuit).toMatchObject({ description: expect.stringMatching(/load-sensing/) });
    expect(otherway.likeForLikeCents).toBe(bid.setTotalCents * 2);
    expect(columns.find((c) => c.shop === "Plainline Hydraulics")!.cheapestComplete).toBe(true);
    expect(offerSummary(bid, null).alternative).toEqual(bid.alternativeCircuit);
  });
});
