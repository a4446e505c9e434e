// The demo offers' parts beyond the bill: each shop answers the kinds of work in its own way,
// states its terms, and one proposes an alternative circuit, so the comparison has something to
// line up. Invented shops of the demo scenario; prices in the spec's currency.
import { alternativeTotals, type AlternativeCircuit, type ExtraKind, type OfferExtra, type OfferTerms, type OwnLine } from "~/content/offer-terms";

/** What the work costs at list price (whole units of the currency), before a shop's factor. */
const LIST: Record<ExtraKind, number> = {
  assembly: 1800,
  wiring: 650,
  flushing: 900,
  documentation: 400,
  freight: 350,
  commissioning: 1500,
  training: 600,
};

interface ShopHabits {
  included: ExtraKind[];
  notOffered: ExtraKind[];
  terms: OfferTerms;
  ownLines: OwnLine[];
}

const HABITS: Record<string, ShopHabits> = {
  "Ironbridge Fluid Power": {
    included: ["documentation"],
    notOffered: ["training"],
    terms: { incoterm: "FCA", place: "Ironbridge works", retainerPercent: 30, onDeliveryPercent: 60, balanceDays: 30, warrantyMonths: 12 },
    ownLines: [{ name: "Spare seal kit for the cylinder", priceCents: 28_000 }],
  },
  "Northgate Hydraulics": {
    included: ["documentation", "freight"],
    notOffered: ["commissioning"],
    terms: { incoterm: "DAP", place: "the buyer's works", retainerPercent: 0, onDeliveryPercent: 90, balanceDays: 30, warrantyMonths: 24 },
    ownLines: [],
  },
  "Coldharbour Power Units": {
    included: ["assembly"],
    notOffered: [],
    terms: { incoterm: "EXW", place: "Coldharbour Lane works", retainerPercent: 40, onDeliveryPercent: 50, balanceDays: 14, warrantyMonths: 12 },
    ownLines: [],
  },
};

/** The extras, own lines and terms a demo shop offers, priced at its factor. */
export function demoOfferParts(shop: string, factor: number): { extras: OfferExtra[]; ownLines: OwnLine[]; offerTerms: OfferTerms | null } {
  const habits = HABITS[shop];
  if (!habits) return { extras: [], ownLines: [], offerTerms: null };
  const extras = (Object.keys(LIST) as ExtraKind[]).map((kind): OfferExtra => {
    if (habits.included.includes(kind)) return { kind, answer: "included", priceCents: null };
    if (habits.notOffered.includes(kind)) return { kind, answer: "not_offered", priceCents: null };
    return { kind, answer: "priced", priceCents: Math.round(LIST[kind] * factor) * 100 };
  });
  return { extras, ownLines: habits.ownLines, offerTerms: habits.terms };
}

/** Northgate's proposal on the panel press: one load-sensing pump instead of the fixed pump and relief. */
export function demoAlternativeCircuit(units: number): AlternativeCircuit {
  const lines = [
    { name: "Load-sensing axial piston pump, 45 cm³/rev", quantity: 1, unitPriceCents: 412_000 },
    { name: "Proportional directional valve with onboard electronics, NG10", quantity: 1, unitPriceCents: 198_000 },
    { name: "Manifold for the load-sensing circuit", quantity: 1, unitPriceCents: 86_000 },
  ];
  return {
    description:
      "A load-sensing pump and a proportional valve in place of the fixed pump, relief and 4/3 valve: the pump delivers only what the ram draws, so the unit runs cooler in the long dwell at force and the approach speed is set from the press's controller.",
    lines,
    ...alternativeTotals(lines, units),
  };
}
