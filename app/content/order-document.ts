import { lineTotalCents } from "./money";

// The order confirmation's content: everything buyer and shop agreed to at the award, written
// once and never changed (the screen, the print and the PDF all read this one record). Pure, so
// the award's service and the demo seed build it the same way.

/** A bid's line as the bid model keeps it. */
interface OfferedLine {
  item: string;
  specification: string;
  quantity: number;
  unitPriceCents: number | null;
  alternative: boolean;
  alternativeDescription: string;
}

export interface OrderParty {
  name: string;
  region: string | null;
}

export interface OrderLine {
  item: string;
  specification: string;
  quantity: number;
  unitPriceCents: number;
  totalCents: number;
  /** The shop offered something else than the bill asked for; `note` says what. */
  alternative: boolean;
  note: string;
}

export interface OrderDocument {
  number: string;
  issuedAt: string;
  spec: { id: string; title: string; revision: number };
  buyer: OrderParty;
  shop: OrderParty;
  awardedBy: string;
  currency: string;
  units: number;
  lines: OrderLine[];
  setTotalCents: number;
  totalCents: number;
  retainerPercent: string;
  retainerCents: number;
  balanceCents: number;
  leadTimeWeeks: number | null;
  /** The handover's target day at the award. */
  handoverBy: string | null;
  offerValidUntil: string | null;
  /** The offer's terms as sentences. */
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
  bid: {
    lines: OfferedLine[];
    units: number;
    setTotalCents: number;
    totalCents: number;
    currency: string;
    leadTimeWeeks: number | null;
    validUntil: string | null;
    notes: string;
  };
  terms: string[];
  retainerPercent: string;
  retainerCents: number;
  handoverBy: string | null;
}): OrderDocument {
  const { bid } = facts;
  return {
    number: facts.number,
    issuedAt: facts.issuedAt.toISOString(),
    spec: facts.spec,
    buyer: facts.buyer,
    shop: facts.shop,
    awardedBy: facts.awardedBy,
    currency: bid.currency,
    units: bid.units,
    lines: bid.lines.map((l) => ({
      item: l.item,
      specification: l.specification,
      quantity: l.quantity,
      unitPriceCents: l.unitPriceCents ?? 0,
      totalCents: lineTotalCents({ quantity: l.quantity, unitPriceCents: l.unitPriceCents ?? 0 }),
      alternative: l.alternative,
      note: l.alternative ? l.alternativeDescription : "",
    })),
    setTotalCents: bid.setTotalCents,
    totalCents: bid.totalCents,
    retainerPercent: facts.retainerPercent,
    retainerCents: facts.retainerCents,
    balanceCents: bid.totalCents - facts.retainerCents,
    leadTimeWeeks: bid.leadTimeWeeks,
    handoverBy: facts.handoverBy,
    offerValidUntil: bid.validUntil,
    terms: facts.terms,
    notes: bid.notes,
  };
}
