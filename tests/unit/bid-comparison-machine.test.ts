// The comparison of a machine's offers, pure: each line names the part it serves, each part has
// a subtotal per offer, and a bid made on the one-axis revision before the machine is shown
// against the machine's bill without its old lines being taken for the power unit's.
import { describe, expect, it } from "vitest";
import { compareBids } from "~/services/bid-comparison";
import type { BidLine } from "~/models/bid.server";
import { POWER_UNIT_LABEL } from "~/services/published-design";
import { comparedBid } from "../support/compared-bids";
import { clampAndPress } from "../support/machines";

const machine = clampAndPress();
const names = machine.axes.map((a) => a.name);
const priced = (keys: string[], cents: (i: number) => number): BidLine[] =>
  keys.map((key, i) => ({ key, item: key, quantity: 1, specification: "", unitPriceCents: cents(i), alternative: false, alternativeDescription: "" }));
const bid = (id: string, revision: number, lines: BidLine[]) => comparedBid(id, lines, { specRevision: revision, validUntil: null });

describe("comparing offers on a machine", () => {
  const keys = machine.bom.map((l) => l.key);
  const current = bid(
    "current",
    2,
    priced(keys, (i) => 1000 + i),
  );
  const older = bid(
    "older",
    1,
    priced(["pump", "cylinder", "directional-valve"], () => 5000),
  );
  const { rows, subtotals, columns } = compareBids(machine.bom, 2, [current, older], "total", names);

  it("names the part of every current line", () => {
    const currentRows = rows.filter((r) => r.inCurrentBill);
    expect(currentRows.map((r) => r.serves)).toEqual(keys.map((k) => (k.includes(":") ? k.split(":")[1] : POWER_UNIT_LABEL)));
  });

  it("adds each offer's part subtotals up to its set total, over the current bill", () => {
    expect(subtotals.map((g) => g.serves)).toEqual([POWER_UNIT_LABEL, ...names]);
    const i = columns.findIndex((c) => c.id === "current");
    expect(subtotals.reduce((s, g) => s + (g.cents[i] ?? 0), 0)).toBe(current.setTotalCents);
    // The older bid priced only "pump" of the current bill: its power unit subtotal is that line; no axis line at all.
    const j = columns.findIndex((c) => c.id === "older");
    expect(subtotals.map((g) => g.cents[j])).toEqual([5000, null, null]);
  });

  it("keeps the lines only the one-axis revision had apart, naming no part for them", () => {
    const old = rows.filter((r) => !r.inCurrentBill);
    expect(old.map((r) => r.key)).toEqual(["cylinder", "directional-valve"]);
    expect(old.map((r) => r.serves)).toEqual([null, null]);
    expect(columns.find((c) => c.id === "older")).toMatchObject({ olderRevision: true, complete: false });
  });

  it("names no part on a bill of one axis", () => {
    const single = compareBids(machine.bom.slice(0, 3), 1, [
      bid(
        "a",
        1,
        priced(keys.slice(0, 3), () => 100),
      ),
    ]);
    expect(single.rows.every((r) => r.serves === null)).toBe(true);
    expect(single.subtotals).toEqual([]);
  });
});
