// The work beyond the bill, the structured terms and the alternative circuit in the comparison
// and in offerSummary, without a database.
import { describe, expect, it } from "vitest";
import type { BomLine } from "~/hydraulics";
import { compareBids, type ComparedBid } from "~/services/bid-comparison";
import { comparedBid } from "../support/compared-bids";
import { offerSummary } from "~/services/offer-summary";
import { INCOTERM_CODES, leavesOut, onDeliveryProblem, paymentText, termsWithRetainer, type ExtraKind, type OfferExtra } from "~/content/offer-terms";

const bom = [
  { key: "pump", item: "Pump", quantity: 1, specification: "" },
  { key: "valve", item: "Valve", quantity: 2, specification: "" },
] as BomLine[];

const priced = (kind: ExtraKind, euros: number): OfferExtra => ({ kind, answer: "priced", priceCents: euros * 100 });
const included = (kind: ExtraKind): OfferExtra => ({ kind, answer: "included", priceCents: null });

/** An offer of one unit: the pump and two valves at the prices given, plus its extras. */
function offer(id: string, pump: number, valve: number, extras: OfferExtra[] = [], more: Partial<ComparedBid> = {}): ComparedBid {
  const set = (pump + 2 * valve) * 100;
  const extrasCents = extras.reduce((s, e) => s + (e.priceCents ?? 0), 0) + (more.ownLines ?? []).reduce((s, l) => s + l.priceCents, 0);
  const lines = [
    { key: "pump", item: "Pump", quantity: 1, specification: "", unitPriceCents: pump * 100, alternative: false, alternativeDescription: "" },
    { key: "valve", item: "Valve", quantity: 2, specification: "", unitPriceCents: valve * 100, alternative: false, alternativeDescription: "" },
  ];
  return comparedBid(id, lines, { extras, totalCents: set + extrasCents, ...more });
}

describe("the work beyond the bill in the comparison", () => {
  it("ranks like for like: only the work every offer covers counts, and says what each leaves out", () => {
    // "full" charges 900 for commissioning that "lean" does not offer; both price assembly.
    // Totals: full 1000 + 200 + 900 = 2100, lean 1100 + 300 = 1400. Like for like leaves
    // commissioning out: full 1200, lean 1400, so full is the cheaper like for like.
    const result = compareBids(bom, 1, [
      offer("full", 600, 200, [priced("assembly", 200), priced("commissioning", 900), included("wiring")]),
      offer("lean", 700, 200, [priced("assembly", 300), included("wiring")]),
    ]);
    const byId = Object.fromEntries(result.columns.map((c) => [c.id, c]));
    expect(byId.full).toMatchObject({ totalCents: 210_000, likeForLikeCents: 120_000, extrasCents: 110_000, cheapestComplete: true });
    expect(byId.lean).toMatchObject({ totalCents: 140_000, likeForLikeCents: 140_000, cheapestComplete: false });
    expect(result.cheapestCompleteId).toBe("full");
    expect(byId.lean.leavesOut).toContain("no commissioning on site offered");
    expect(byId.full.leavesOut).not.toContain("no commissioning on site offered");
    expect(byId.full.leavesOut).toContain("no training offered");

    const rows = Object.fromEntries(result.extraRows.map((r) => [r.kind, r]));
    expect(rows.assembly.common).toBe(true);
    expect(rows.wiring.common).toBe(true);
    expect(rows.commissioning.common).toBe(false);
    // Columns are in total order: lean (1400) before full (2100).
    expect(result.columns.map((c) => c.id)).toEqual(["lean", "full"]);
    expect(rows.assembly.cells.map((c) => c.lowest)).toEqual([false, true]);
    expect(rows.commissioning.cells.map((c) => c.answer)).toEqual(["not_offered", "priced"]);
  });

  it("leaves the shop's own lines out of like for like but in the total", () => {
    const result = compareBids(bom, 1, [offer("own", 600, 200, [], { ownLines: [{ name: "Spare seal kit", priceCents: 5_000 }] })]);
    expect(result.columns[0]).toMatchObject({ totalCents: 105_000, likeForLikeCents: 100_000, extrasCents: 5_000 });
  });

  it("an alternative circuit is carried beside its offer, never in the like-for-like figures", () => {
    const alternativeCircuit = {
      description: "Two pumps instead of one",
      lines: [{ name: "Pump pair", quantity: 1, unitPriceCents: 10_000 }],
      setTotalCents: 10_000,
      totalCents: 10_000,
    };
    const result = compareBids(bom, 1, [offer("alt", 600, 200, [], { alternativeCircuit }), offer("plain", 500, 200)]);
    const alt = result.columns.find((c) => c.id === "alt")!;
    expect(alt.alternativeCircuit).toEqual(alternativeCircuit);
    expect(alt.likeForLikeCents).toBe(100_000);
    expect(result.cheapestCompleteId).toBe("plain");
  });
});

describe("leavesOut", () => {
  it("names every kind not covered, in the form's order", () => {
    expect(leavesOut([priced("assembly", 1), included("wiring"), { kind: "flushing", answer: "not_offered", priceCents: null }])).toEqual([
      "no flushing and testing offered",
      "no documentation offered",
      "no packing and freight offered",
      "no commissioning on site offered",
      "no training offered",
    ]);
  });
});

describe("offerSummary", () => {
  it("gives the lines, the work beyond the bill, the terms in words and the totals", () => {
    const summary = offerSummary(
      {
        lines: offer("x", 600, 200).lines,
        units: 2,
        currency: "EUR",
        leadTimeWeeks: 12,
        validUntil: "2030-03-01",
        notes: "",
        extras: [priced("commissioning", 1_500), included("documentation")],
        ownLines: [{ name: "Site survey", priceCents: 40_000 }],
        offerTerms: { incoterm: "DAP", place: "Porto", retainerPercent: 30, onDeliveryPercent: 60, balanceDays: 30, warrantyMonths: 24 },
        alternativeCircuit: null,
      },
      20,
    );
    // The bill: (600 + 2 × 200) × 2 units = 2000.00; commissioning 1500 and the survey 400 once.
    expect(summary.totals).toEqual({ setTotalCents: 100_000, billCents: 200_000, extrasCents: 150_000, ownLinesCents: 40_000, totalCents: 390_000 });
    expect(summary.extras.map((e) => e.answer)).toEqual(["not_offered", "not_offered", "not_offered", "included", "not_offered", "priced", "not_offered"]);
    expect(summary.terms).toMatchObject({ incoterm: "DAP", incotermName: "Delivered at Place", place: "Porto", warrantyMonths: 24 });
    expect(summary.termsText).toEqual([
      "Delivery: DAP Porto (Delivered at Place, Incoterms 2020).",
      "Payment: 20 % with the order (the retainer, paid by card through Tenderflow), 60 % on delivery, 20 % 30 days after invoice.",
      "24 months warranty.",
      "Lead time: 12 weeks from the award.",
      "Offer valid until 1 Mar 2030.",
    ]);
    expect(summary.lines[1]).toMatchObject({ item: "Valve", quantity: 2, unitPriceCents: 20_000, totalCents: 40_000 });
  });

  it("reads an offer made before structured terms, its free text kept", () => {
    const summary = offerSummary(
      { lines: [], units: 1, currency: "GBP", leadTimeWeeks: null, validUntil: null, notes: "", terms: "Ex works, 30 days net" },
      20,
    );
    expect(summary.termsText).toEqual(["Terms as written: Ex works, 30 days net"]);
    expect(summary.leavesOut).toHaveLength(7);
    expect(summary.totals.totalCents).toBe(0);
  });

  it("puts the spec's retainer as the share with the order, an older offer's share on delivery giving way", () => {
    // Stored before the rule: 10 % with the order, 90 % on delivery, beside a 20 % retainer.
    const stored = { incoterm: "EXW" as const, place: "Leeds", retainerPercent: 10, onDeliveryPercent: 90, balanceDays: 30, warrantyMonths: 12 };
    const summary = offerSummary({ lines: [], units: 1, currency: "GBP", leadTimeWeeks: null, validUntil: null, notes: "", offerTerms: stored }, "20.00");
    expect(summary.terms.payment).toBe("20 % with the order (the retainer, paid by card through Tenderflow), 80 % on delivery");
    expect(termsWithRetainer({ ...stored, onDeliveryPercent: 50 }, 20)).toMatchObject({ retainerPercent: 20, onDeliveryPercent: 50 });
    expect(onDeliveryProblem(20, 80)).toBeNull();
    expect(onDeliveryProblem(20, 90)).toBe("The retainer (20 %) and on delivery add up to 110 %; at most 80 % on delivery.");
  });
});

describe("the terms' wording", () => {
  it("lists the eleven Incoterms 2020 rules", () => {
    expect(INCOTERM_CODES).toEqual(["EXW", "FCA", "CPT", "CIP", "DAP", "DPU", "DDP", "FAS", "FOB", "CFR", "CIF"]);
  });
  it("says payment terms in words, the rest on invoice when no days are given", () => {
    expect(paymentText({ retainerPercent: 100, onDeliveryPercent: null, balanceDays: null })).toBe(
      "100 % with the order (the retainer, paid by card through Tenderflow)",
    );
    expect(paymentText({ retainerPercent: 20, onDeliveryPercent: null, balanceDays: 0 })).toBe(
      "20 % with the order (the retainer, paid by card through Tenderflow), 80 % on invoice",
    );
    expect(paymentText({ retainerPercent: null, onDeliveryPercent: null, balanceDays: null })).toBeNull();
  });
});
