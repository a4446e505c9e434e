// What an offer carries beyond the bill, shared by the bid form, the comparison, the workbook and
// the order confirmation: the work a shop sells with a power unit, the shop's own lines, the
// delivery and payment terms, and an alternative circuit. Pure data and wording, no I/O.
import { bidTotals, type PricedLine } from "./money";

/**
 * The Incoterms® 2020 rules by their three-letter codes, as published by the International
 * Chamber of Commerce (ICC, "Incoterms® 2020", publication 723E): seven for any mode of transport,
 * four for sea and inland waterway. The named place is the one each rule asks for (from memory of
 * the ICC text: delivery for E/F rules, destination for C and D rules).
 */
export const INCOTERMS_2020 = {
  EXW: { name: "Ex Works", place: "named place of delivery" },
  FCA: { name: "Free Carrier", place: "named place of delivery" },
  CPT: { name: "Carriage Paid To", place: "named place of destination" },
  CIP: { name: "Carriage and Insurance Paid To", place: "named place of destination" },
  DAP: { name: "Delivered at Place", place: "named place of destination" },
  DPU: { name: "Delivered at Place Unloaded", place: "named place of destination" },
  DDP: { name: "Delivered Duty Paid", place: "named place of destination" },
  FAS: { name: "Free Alongside Ship", place: "named port of shipment" },
  FOB: { name: "Free On Board", place: "named port of shipment" },
  CFR: { name: "Cost and Freight", place: "named port of destination" },
  CIF: { name: "Cost, Insurance and Freight", place: "named port of destination" },
} as const;
export type Incoterm = keyof typeof INCOTERMS_2020;
export const INCOTERM_CODES = Object.keys(INCOTERMS_2020) as [Incoterm, ...Incoterm[]];

/** The work beyond the bill a shop is asked about, in the order the form and the comparison show it. */
export const EXTRA_KINDS = {
  assembly: "Assembly and manifold",
  wiring: "Wiring",
  flushing: "Flushing and testing",
  documentation: "Documentation",
  freight: "Packing and freight",
  commissioning: "Commissioning on site",
  training: "Training",
} as const;
export type ExtraKind = keyof typeof EXTRA_KINDS;
export const EXTRA_KEYS = Object.keys(EXTRA_KINDS) as [ExtraKind, ...ExtraKind[]];

/** How an offer answers one kind of work. */
export const EXTRA_ANSWERS = ["priced", "included", "not_offered"] as const;
export type ExtraAnswer = (typeof EXTRA_ANSWERS)[number];
export const EXTRA_ANSWER_LABELS: Record<ExtraAnswer, string> = { priced: "Priced", included: "Included", not_offered: "Not offered" };

/** One answer per kind of work, for the whole order (not per unit). */
export interface OfferExtra {
  kind: ExtraKind;
  answer: ExtraAnswer;
  /** set only when priced */
  priceCents: number | null;
}

/** A line of the shop's own (spare parts kit, site survey, …), for the whole order. */
export interface OwnLine {
  name: string;
  priceCents: number;
}

export const OFFER_LIMITS = { ownLines: 10, alternativeLines: 30, ownLineName: 120, place: 120, description: 2000 } as const;

export interface OfferTerms {
  incoterm: Incoterm | null;
  place: string;
  /**
   * percent of the price with the order (the spec's retainer: see termsWithRetainer), on
   * delivery; the rest is due `balanceDays` after invoice
   */
  retainerPercent: number | null;
  onDeliveryPercent: number | null;
  balanceDays: number | null;
  warrantyMonths: number | null;
}

export const NO_TERMS: OfferTerms = { incoterm: null, place: "", retainerPercent: null, onDeliveryPercent: null, balanceDays: null, warrantyMonths: null };

export interface AlternativeLine {
  name: string;
  quantity: number;
  unitPriceCents: number;
}

/** A different circuit proposed as a whole, priced on its own bill (one set, then every unit). */
export interface AlternativeCircuit {
  description: string;
  lines: AlternativeLine[];
  setTotalCents: number;
  totalCents: number;
}

/** "FCA Hamburg (Free Carrier, Incoterms 2020)"; null while not stated. */
export function deliveryText(terms: Pick<OfferTerms, "incoterm" | "place">): string | null {
  if (!terms.incoterm) return null;
  const place = terms.place.trim();
  return `${terms.incoterm}${place ? ` ${place}` : ""} (${INCOTERMS_2020[terms.incoterm].name}, Incoterms 2020)`;
}

/**
 * The payment terms beside the portal's retainer: the share with the order IS the spec's retainer
 * (the buyer pays it by card through Tenderflow on award), whatever an offer stored before this
 * rule said; an older offer's share on delivery gives way so the shares add up to at most 100 %.
 */
export function termsWithRetainer(terms: OfferTerms, retainerPercent: number | string | null): OfferTerms {
  if (retainerPercent === null) return terms;
  const retainer = Number(retainerPercent);
  const onDelivery = terms.onDeliveryPercent === null ? null : Math.min(terms.onDeliveryPercent, 100 - retainer);
  return { ...terms, retainerPercent: retainer, onDeliveryPercent: onDelivery };
}

/** The share with the order in words: "20 % with the order: the retainer, paid by card through Tenderflow". */
export const retainerShareText = (percent: number) => `${percent} % with the order: the retainer, paid by card through Tenderflow`;

/** Whether a shop's share on delivery fits beside the retainer; the problem in words if not. */
export function onDeliveryProblem(retainerPercent: number, onDeliveryPercent: number | undefined): string | null {
  const upFront = retainerPercent + (onDeliveryPercent ?? 0);
  return upFront > 100 ? `The retainer (${retainerPercent} %) and on delivery add up to ${upFront} %; at most ${100 - retainerPercent} % on delivery.` : null;
}

/** "20 % with the order (the retainer, paid by card through Tenderflow), 70 % on delivery, 10 % 30 days after invoice"; null while not stated. */
export function paymentText(terms: Pick<OfferTerms, "retainerPercent" | "onDeliveryPercent" | "balanceDays">): string | null {
  const { retainerPercent: first, onDeliveryPercent: delivery, balanceDays } = terms;
  if (first === null && delivery === null && balanceDays === null) return null;
  const rest = 100 - (first ?? 0) - (delivery ?? 0);
  const parts = [first ? `${first} % with the order (the retainer, paid by card through Tenderflow)` : "", delivery ? `${delivery} % on delivery` : ""];
  if (rest > 0) parts.push(`${rest} % ${balanceDays ? `${balanceDays} days after invoice` : "on invoice"}`);
  return parts.filter(Boolean).join(", ");
}

export const warrantyText = (months: number | null) => (months === null ? null : months === 0 ? "No warranty" : `${months} months warranty`);

/** The kinds of work an offer does not cover, as the comparison says it: "no commissioning offered". */
export function leavesOut(extras: readonly OfferExtra[]): string[] {
  const covered = new Set(extras.filter((e) => e.answer !== "not_offered").map((e) => e.kind));
  return EXTRA_KEYS.filter((k) => !covered.has(k)).map((k) => `no ${EXTRA_KINDS[k].toLowerCase()} offered`);
}

/** Every kind of work in the form's order, answered as the offer does (unanswered: not offered). */
export function extrasInOrder(extras: readonly OfferExtra[]): (OfferExtra & { name: string })[] {
  const byKind = new Map(extras.map((e) => [e.kind, e]));
  return EXTRA_KEYS.map((kind) => ({ ...(byKind.get(kind) ?? { kind, answer: "not_offered" as const, priceCents: null }), name: EXTRA_KINDS[kind] }));
}

/**
 * An offer's money: the bill (one set, then every unit wanted) plus the work beyond it and the
 * shop's own lines, each once for the whole order. The total is what the buyer pays on award.
 */
export function offerTotals(bill: PricedLine[], units: number, extras: readonly OfferExtra[], ownLines: readonly OwnLine[]) {
  const { setTotalCents, totalCents: billCents } = bidTotals(bill, units);
  const extrasCents = extras.reduce((sum, e) => sum + (e.answer === "priced" ? (e.priceCents ?? 0) : 0), 0);
  const ownLinesCents = ownLines.reduce((sum, l) => sum + l.priceCents, 0);
  return { setTotalCents, billCents, extrasCents, ownLinesCents, totalCents: billCents + extrasCents + ownLinesCents };
}

/** The alternative circuit's money: its bill once, then every unit wanted. */
export function alternativeTotals(lines: readonly AlternativeLine[], units: number) {
  return bidTotals(
    lines.map((l) => ({ quantity: l.quantity, unitPriceCents: l.unitPriceCents })),
    units,
  );
}
