// The buyer's side-by-side view of offered bids, pure so it is tested without a database:
// lines down (the current bill first, then lines only older revisions had), bids across,
// the lowest price per line and the cheapest complete offer marked. A line priced 0 is
// included elsewhere in that offer: it is shown as included, never as the lowest price.
import type { BomLine } from "~/hydraulics";
import type { BidLine } from "~/models/bid.server";
import type { BidStatus } from "~/content/bid-status";
import { lineTotalCents } from "~/content/money";
import { servedBy } from "./published-design";

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
  /** the shop's delivery and payment terms, and its notes on the offer, as written */
  terms: string;
  notes: string;
}

export const COMPARISON_SORTS = ["total", "lead", "valid", "shop"] as const;
export type ComparisonSort = (typeof COMPARISON_SORTS)[number];

export interface ComparisonColumn extends Omit<ComparedBid, "lines"> {
  /** Made against an earlier revision of the spec than the current one. */
  olderRevision: boolean;
  /** Prices every line of the current bill. */
  complete: boolean;
  alternatives: number;
  cheapestComplete: boolean;
  shortestLead: boolean;
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

  const complete = priced.map((lines) => bom.every((l) => lines.has(l.key)));
  const completeTotals = ordered.filter((_, i) => complete[i]).map((b) => b.totalCents);
  const cheapest = completeTotals.length ? Math.min(...completeTotals) : null;
  const leads = ordered.map((b) => b.leadTimeWeeks).filter((w): w is number => w !== null);
  const shortest = leads.length ? Math.min(...leads) : null;

  const columns: ComparisonColumn[] = ordered.map(({ lines, ...bid }, i) => ({
    ...bid,
    olderRevision: bid.specRevision < currentRevision,
    complete: complete[i],
    alternatives: lines.filter((l) => l.alternative).length,
    cheapestComplete: complete[i] && bid.totalCents === cheapest,
    shortestLead: ordered.length > 1 && bid.leadTimeWeeks !== null && bid.leadTimeWeeks === shortest,
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
  return { columns, rows, subtotals, cheapestCompleteId: columns.find((c) => c.cheapestComplete)?.id ?? null };
}
