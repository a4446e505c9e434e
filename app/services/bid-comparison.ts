// The buyer's side-by-side view of offered bids, pure so it is tested without a database:
// lines down (the current bill first, then lines only older revisions had), bids across,
// the lowest price per line and the cheapest complete offer marked. A line priced 0 is
// included elsewhere in that offer: it is shown as included, never as the lowest price.
// Below the bill, the work beyond it lines up by kind across offers; "like for like" is the bill
// plus the kinds of work every offer covers, so an offer that prices commissioning is not ranked
// dearer than one that leaves it out, and what each leaves out is said in words. An alternative
// circuit is shown beside its offer, never ranked against the like-for-like prices.
import type { BomLine } from "~/hydraulics";
import type { BidLine } from "~/models/bid.server";
import type { BidStatus } from "~/content/bid-status";
import { lineTotalCents } from "~/content/money";
import { servedBy } from "./published-design";
import {
  EXTRA_KEYS,
  deliveryText,
  extrasInOrder,
  leavesOut,
  paymentText,
  warrantyText,
  type AlternativeCircuit,
  type ExtraAnswer,
  type ExtraKind,
  type OfferExtra,
  type OfferTerms,
  type OwnLine,
} from "~/content/offer-terms";

export interface ComparedBid {
  id: string;
  shop: string;
  status: BidStatus;
  specRevision: number;
  lines: BidLine[];
  setTotalCents: number;
  totalCents: number;
  leadTimeWeeks: number | null;
  validUntil: string | null;
  extras: OfferExtra[];
  ownLines: OwnLine[];
  offerTerms: OfferTerms | null;
  alternativeCircuit: AlternativeCircuit | null;
  /** the shop's notes on the offer, as written */
  notes: string;
}

export const COMPARISON_SORTS = ["total", "lead", "valid", "shop"] as const;
export type ComparisonSort = (typeof COMPARISON_SORTS)[number];

export interface ComparisonColumn extends Omit<ComparedBid, "lines" | "extras"> {
  /** Made against an earlier revision of the spec than the current one. */
  olderRevision: boolean;
  /** Prices every line of the current bill. */
  complete: boolean;
  alternatives: number;
  /** the cheapest like-for-like offer among those pricing every line of the bill */
  cheapestComplete: boolean;
  shortestLead: boolean;
  /** the bill and the kinds of work every offer covers, the figure offers are ranked by */
  likeForLikeCents: number;
  /** what the work beyond the bill and the shop's own lines add to the total */
  extrasCents: number;
  leavesOut: string[];
  delivery: string | null;
  payment: string | null;
  warranty: string | null;
}

/** One kind of work beyond the bill across the offers. */
export interface ExtraRow {
  kind: ExtraKind;
  name: string;
  /** every offer covers it (priced or included), so it counts in the like-for-like figure */
  common: boolean;
  cells: { answer: ExtraAnswer; priceCents: number | null; lowest: boolean }[];
}

export interface ComparisonCell {
  unitPriceCents: number;
  lineTotalCents: number;
  alternative: boolean;
  alternativeDescription: string;
  /** priced 0: the shop includes this line elsewhere in its offer */
  included: boolean;
  lowest: boolean;
}

export interface ComparisonRow {
  key: string;
  item: string;
  quantity: number;
  specification: string;
  inCurrentBill: boolean;
  /** a machine's bill: the axis the line serves, or the power unit; null for one axis */
  serves: string | null;
  cells: (ComparisonCell | null)[];
}

/** A machine's offers split by what the lines serve: each bid's sum of its priced lines of the current bill (one set). */
export interface ComparisonSubtotal {
  serves: string;
  cents: (number | null)[];
}

const SORTERS: Record<ComparisonSort, (a: ComparedBid, b: ComparedBid) => number> = {
  total: (a, b) => a.totalCents - b.totalCents,
  lead: (a, b) => (a.leadTimeWeeks ?? Infinity) - (b.leadTimeWeeks ?? Infinity),
  valid: (a, b) => (b.validUntil ?? "").localeCompare(a.validUntil ?? ""),
  shop: (a, b) => a.shop.localeCompare(b.shop),
};

export function compareBids(bom: BomLine[], currentRevision: number, bids: ComparedBid[], sort: ComparisonSort = "total", axisNames: string[] = []) {
  const ordered = [...bids].sort((a, b) => SORTERS[sort](a, b) || a.totalCents - b.totalCents || a.id.localeCompare(b.id));
  const priced = ordered.map((bid) => new Map(bid.lines.filter((l) => l.unitPriceCents !== null).map((l) => [l.key, l])));

  const currentKeys = new Set(bom.map((l) => l.key));
  const extra = new Map<string, BidLine>();
  for (const bid of ordered) for (const line of bid.lines) if (!currentKeys.has(line.key) && !extra.has(line.key)) extra.set(line.key, line);

  const rows: ComparisonRow[] = [...bom.map((l) => ({ ...l, inCurrentBill: true })), ...[...extra.values()].map((l) => ({ ...l, inCurrentBill: false }))].map(
    (line) => {
      const cells = priced.map((lines) => {
        const l = lines.get(line.key);
        if (!l) return null;
        const total = lineTotalCents({ quantity: l.quantity, unitPriceCents: l.unitPriceCents! });
        return {
          unitPriceCents: l.unitPriceCents!,
          lineTotalCents: total,
          alternative: l.alternative,
          alternativeDescription: l.alternativeDescription,
          included: total === 0,
          lowest: false,
        };
      });
      // Only real prices compete: an included line costs its price somewhere else in the offer.
      const charged = cells.filter((c): c is ComparisonCell => c !== null && !c.included);
      if (charged.length > 1) {
        const min = Math.min(...charged.map((c) => c.lineTotalCents));
        for (const c of charged) c.lowest = c.lineTotalCents === min;
      }
      return {
        key: line.key,
        item: line.item,
        quantity: line.quantity,
        specification: line.specification,
        inCurrentBill: line.inCurrentBill,
        // A line only an earlier revision had names its axis only if it carries one (`cylinder:Clamp`): an axis's key from before the machine had none.
        serves: line.inCurrentBill || line.key.includes(":") ? servedBy(line.key, axisNames) : null,
        cells,
      };
    },
  );

  const extraRows = extraRowsOf(ordered);
  const extrasCents = ordered.map(
    (b) => b.extras.reduce((sum, e) => sum + (e.answer === "priced" ? (e.priceCents ?? 0) : 0), 0) + b.ownLines.reduce((sum, l) => sum + l.priceCents, 0),
  );
  const likeForLike = ordered.map(
    (b, i) => b.totalCents - extrasCents[i] + extraRows.reduce((sum, row) => sum + (row.common ? (row.cells[i].priceCents ?? 0) : 0), 0),
  );
  const complete = priced.map((lines) => bom.every((l) => lines.has(l.key)));
  const completeTotals = likeForLike.filter((_, i) => complete[i]);
  const cheapest = completeTotals.length ? Math.min(...completeTotals) : null;
  const leads = ordered.map((b) => b.leadTimeWeeks).filter((w): w is number => w !== null);
  const shortest = leads.length ? Math.min(...leads) : null;

  const columns: ComparisonColumn[] = ordered.map(({ lines, extras, ...bid }, i) => ({
    ...bid,
    olderRevision: bid.specRevision < currentRevision,
    complete: complete[i],
    alternatives: lines.filter((l) => l.alternative).length,
    cheapestComplete: complete[i] && likeForLike[i] === cheapest,
    shortestLead: ordered.length > 1 && bid.leadTimeWeeks !== null && bid.leadTimeWeeks === shortest,
    likeForLikeCents: likeForLike[i],
    extrasCents: extrasCents[i],
    leavesOut: leavesOut(extras),
    delivery: bid.offerTerms ? deliveryText(bid.offerTerms) : null,
    payment: bid.offerTerms ? paymentText(bid.offerTerms) : null,
    warranty: bid.offerTerms ? warrantyText(bid.offerTerms.warrantyMonths) : null,
  }));
  // In the bill's order: the power unit, then each axis. Null where a bid prices none of a part's lines.
  const subtotals: ComparisonSubtotal[] = [];
  for (const row of rows.filter((r) => r.inCurrentBill && r.serves !== null)) {
    let group = subtotals.find((g) => g.serves === row.serves);
    if (!group) subtotals.push((group = { serves: row.serves!, cents: ordered.map(() => null) }));
    row.cells.forEach((cell, i) => {
      if (cell) group.cents[i] = (group.cents[i] ?? 0) + cell.lineTotalCents;
    });
  }
  return { columns, rows, subtotals, extraRows, cheapestCompleteId: columns.find((c) => c.cheapestComplete)?.id ?? null };
}

/** Each kind of work across the offers, the lowest price marked where two or more price it. */
function extraRowsOf(bids: ComparedBid[]): ExtraRow[] {
  const answered = bids.map((b) => extrasInOrder(b.extras));
  return EXTRA_KEYS.map((kind, k) => {
    const cells = answered.map((extras) => ({
      answer: extras[k].answer,
      priceCents: extras[k].answer === "priced" ? extras[k].priceCents : null,
      lowest: false,
    }));
    const prices = cells.filter((c) => c.answer === "priced");
    if (prices.length > 1) {
      const min = Math.min(...prices.map((c) => c.priceCents ?? 0));
      for (const c of prices) c.lowest = c.priceCents === min;
    }
    return { kind, name: answered[0]?.[k].name ?? kind, common: bids.length > 0 && cells.every((c) => c.answer !== "not_offered"), cells };
  });
}
