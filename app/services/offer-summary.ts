// One reading of an offer for every document made from it (the order confirmation, the priced
// bill, the comparison's terms): its lines, the work beyond the bill, the terms in words and the
// totals. Pure: it takes the bid row or a version's offer as they are stored.
import type { BidOffer } from "~/models/bid.server";
import { lineTotalCents } from "~/content/money";
import {
  INCOTERMS_2020,
  NO_TERMS,
  deliveryText,
  extrasInOrder,
  leavesOut,
  offerTotals,
  paymentText,
  termsWithRetainer,
  warrantyText,
  type AlternativeCircuit,
  type OfferTerms,
} from "~/content/offer-terms";
import { formatDay } from "~/content/dates";

/** What offerSummary reads: a Bid row or a BidVersion's offer. */
export type SummarisedOffer = Pick<BidOffer, "lines" | "units" | "currency" | "leadTimeWeeks" | "validUntil" | "notes"> &
  Partial<Pick<BidOffer, "extras" | "ownLines" | "offerTerms" | "alternativeCircuit" | "terms">>;

export interface OfferSummary {
  currency: string;
  units: number;
  lines: {
    key: string;
    item: string;
    specification: string;
    quantity: number;
    unitPriceCents: number;
    totalCents: number;
    alternative: boolean;
    note: string;
  }[];
  /** every kind of work beyond the bill, in the form's order */
  extras: ReturnType<typeof extrasInOrder>;
  ownLines: { name: string; priceCents: number }[];
  /** "no commissioning on site offered", … */
  leavesOut: string[];
  terms: OfferTerms & {
    incotermName: string | null;
    delivery: string | null;
    payment: string | null;
    warranty: string | null;
    validUntil: string | null;
    leadTimeWeeks: number | null;
  };
  /** The terms as sentences, for a document; an old offer's free-text terms as written. */
  termsText: string[];
  totals: ReturnType<typeof offerTotals>;
  alternative: AlternativeCircuit | null;
  notes: string;
}

/** `retainerPercent`: the spec's (or job's) retainer, the share with the order whatever the offer stored. */
export function offerSummary(offer: SummarisedOffer, retainerPercent: number | string | null): OfferSummary {
  // An offer made before structured terms states none: no retainer share is put in its mouth.
  const terms = offer.offerTerms ? termsWithRetainer(offer.offerTerms, retainerPercent) : NO_TERMS;
  const extras = extrasInOrder(offer.extras ?? []);
  const ownLines = offer.ownLines ?? [];
  const lines = offer.lines.map((l) => {
    const unitPriceCents = l.unitPriceCents ?? 0;
    return {
      key: l.key,
      item: l.item,
      specification: l.specification,
      quantity: l.quantity,
      unitPriceCents,
      totalCents: lineTotalCents({ quantity: l.quantity, unitPriceCents }),
      alternative: l.alternative,
      note: l.alternative ? l.alternativeDescription : "",
    };
  });
  const described = {
    ...terms,
    incotermName: terms.incoterm ? INCOTERMS_2020[terms.incoterm].name : null,
    delivery: deliveryText(terms),
    payment: paymentText(terms),
    warranty: warrantyText(terms.warrantyMonths),
    validUntil: offer.validUntil,
    leadTimeWeeks: offer.leadTimeWeeks,
  };
  const termsText = [
    described.delivery && `Delivery: ${described.delivery}.`,
    described.payment && `Payment: ${described.payment}.`,
    described.warranty && `${described.warranty}.`,
    offer.leadTimeWeeks !== null && `Lead time: ${offer.leadTimeWeeks} weeks from the award.`,
    offer.validUntil && `Offer valid until ${formatDay(offer.validUntil)}.`,
    offer.terms?.trim() && `Terms as written: ${offer.terms.trim()}`,
  ].filter((t): t is string => Boolean(t));
  return {
    currency: offer.currency,
    units: offer.units,
    lines,
    extras,
    ownLines,
    leavesOut: leavesOut(extras),
    terms: described,
    termsText,
    totals: offerTotals(lines, offer.units, extras, ownLines),
    alternative: offer.alternativeCircuit ?? null,
    notes: offer.notes,
  };
}
