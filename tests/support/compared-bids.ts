// Offers as the bid comparison reads them, for the tests of compareBids without a database.
import type { ComparedBid } from "~/services/bid-comparison";

/**
 * A submitted offer of revision 1 whose bill is `lines` and whose totals are the bill's sum:
 * nothing beyond the bill, no terms, no alternative circuit, unless `more` says otherwise.
 */
export function comparedBid(id: string, lines: ComparedBid["lines"], more: Partial<ComparedBid> = {}): ComparedBid {
  const set = lines.reduce((sum, l) => sum + l.quantity * (l.unitPriceCents ?? 0), 0);
  return {
    id,
    shop: id,
    status: "submitted",
    specRevision: 1,
    lines,
    setTotalCents: set,
    totalCents: set,
    leadTimeWeeks: 10,
    validUntil: "2030-01-01",
    extras: [],
    ownLines: [],
    offerTerms: null,
    alternativeCircuit: null,
    notes: "",
    ...more,
  };
}
