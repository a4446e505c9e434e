import type { OrganisationProfile } from "~/components/organisation-profile";
import type { OfferSummary } from "~/services/offer-summary";

// The order confirmation's content: everything buyer and shop agreed to at the award, written
// once and never changed (the screen, the print and the PDF all read this one record). Built from
// the awarded offer's `offerSummary` and both parties' company profiles; pure, so the award's
// service and the demo seed build it the same way.

export type OrderParty = OrganisationProfile;

export interface OrderDocument {
  number: string;
  issuedAt: string;
  spec: { id: string; title: string; revision: number };
  buyer: OrderParty;
  shop: OrderParty;
  awardedBy: string;
  currency: string;
  units: number;
  /** The bill's lines as priced (for one set). */
  lines: OfferSummary["lines"];
  /** Work beyond the bill the offer includes or prices (each once for the order). */
  extras: { name: string; priceCents: number | null }[];
  ownLines: OfferSummary["ownLines"];
  /** What the offer leaves out ("no commissioning on site offered"). */
  leavesOut: string[];
  setTotalCents: number;
  totalCents: number;
  retainerPercent: string;
  retainerCents: number;
  balanceCents: number;
  leadTimeWeeks: number | null;
  /** The handover's target day at the award. */
  handoverBy: string | null;
  offerValidUntil: string | null;
  /** The offer's terms as sentences (delivery, payment, warranty, ...). */
  terms: string[];
  notes: string;
}

/** Our order numbers: TF-<year of the award>-<six-digit serial>, e.g. TF-2026-000042. */
export const orderNumber = (year: number, serial: number) => `TF-${year}-${String(serial).padStart(6, "0")}`;

export function buildOrderDocument(facts: {
  number: string;
  issuedAt: Date;
  spec: { id: string; title: string; revision: number };
  buyer: OrderParty;
  shop: OrderParty;
  awardedBy: string;
  offer: OfferSummary;
  /** The job's price (the award's figure) and its retainer. */
  totalCents: number;
  retainerPercent: string;
  retainerCents: number;
  handoverBy: string | null;
}): OrderDocument {
  const { offer } = facts;
  return {
    number: facts.number,
    issuedAt: facts.issuedAt.toISOString(),
    spec: facts.spec,
    buyer: facts.buyer,
    shop: facts.shop,
    awardedBy: facts.awardedBy,
    currency: offer.currency,
    units: offer.units,
    lines: offer.lines,
    extras: offer.extras.filter((e) => e.answer !== "not_offered").map((e) => ({ name: e.name, priceCents: e.answer === "priced" ? e.priceCents : null })),
    ownLines: offer.ownLines,
    leavesOut: offer.leavesOut,
    setTotalCents: offer.totals.setTotalCents,
    totalCents: facts.totalCents,
    retainerPercent: facts.retainerPercent,
    retainerCents: facts.retainerCents,
    balanceCents: facts.totalCents - facts.retainerCents,
    leadTimeWeeks: offer.terms.leadTimeWeeks,
    handoverBy: facts.handoverBy,
    offerValidUntil: offer.terms.validUntil,
    terms: offer.termsText,
    notes: offer.notes,
  };
}
