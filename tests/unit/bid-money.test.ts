// Bid money and the comparison, without a database.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { bidTotals, centsToInput, moneyProblem, parseMoney, retainerCents } from "~/content/money";
import { compareBids, type ComparedBid } from "~/services/bid-comparison";
import { comparedBid } from "../support/compared-bids";
import type { BomLine } from "~/hydraulics";

describe("parseMoney", () => {
  it.each([
    ["1234.5", 123_450],
    ["1,234.50", 123_450],
    ["1 234", 123_400],
    ["0", 0],
    ["0.07", 7],
    ["12,345,678.9", 1_234_567_890],
  ])("reads %s as %i cents", (text, cents) => expect(parseMoney(text)).toBe(cents));

  it.each(["", "-5", "12,50", "1.234", "1e3", "abc", "1,23.00", "€12"])("refuses %j", (text) => expect(parseMoney(text)).toBeNull());

  it("round-trips every amount through the input format exactly", () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 1e13 }), (cents) => parseMoney(centsToInput(cents)) === cents));
  });
});

describe("moneyProblem", () => {
  it.each([
    ["12,50", "Use a point for decimals: 12.50."],
    ["-5", "A price can't be negative; enter 0 for a line included elsewhere."],
    ["0.005", "At most two decimals (whole cents)."],
    ["£41", "Digits only, without a currency sign: e.g. 1250 or 1250.50."],
    ["1e3", "Digits only, without a currency sign: e.g. 1250 or 1250.50."],
    ["1,23.00", "Enter an amount like 1250 or 1250.50."],
  ])("explains %j", (text, message) => expect(moneyProblem(text)).toBe(message));

  it("has nothing to say about a good amount", () => expect(moneyProblem("1,250.50")).toBeNull());
});

describe("bidTotals", () => {
  it("adds quantity × unit price per line, then multiplies the set by the units wanted", () => {
    // 2 × 10.05 + 1 × 0.10 + 4 × 99.99 = 20.10 + 0.10 + 399.96 = 420.16 a set; 3 sets = 1260.48
    expect(
      bidTotals(
        [
          { quantity: 2, unitPriceCents: 1005 },
          { quantity: 1, unitPriceCents: 10 },
          { quantity: 4, unitPriceCents: 9999 },
        ],
        3,
      ),
    ).toEqual({ setTotalCents: 42_016, totalCents: 126_048 });
  });
});

describe("retainerCents", () => {
  it.each([
    // Worked by hand: 20 % of 12 345.67 = 2 469.134 → 2 469.13
    [1_234_567, "20.00", 246_913],
    // 12.5 % of 0.04 = 0.005 → half a cent rounds up to 0.01
    [4, "12.50", 1],
    // 12.5 % of 0.03 = 0.00375 → 0.00
    [3, "12.50", 0],
    [999_999_999_999, "50", 500_000_000_000],
    [100_000, "0", 0],
  ])("%i cents at %s %% is %i cents", (total, percent, expected) => expect(retainerCents(total, percent)).toBe(expected));

  it("agrees with Math.round over floats wherever floats are still exact", () => {
    // Below 2^53 the product total × basis points is an exact double, and a tie (…5000 / 10 000)
    // divides to an exact x.5, so Math.round (half up) is an independent oracle there.
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1e11 }), fc.integer({ min: 0, max: 5000 }), (total, bp) => {
        const percent = `${Math.floor(bp / 100)}.${String(bp % 100).padStart(2, "0")}`;
        return retainerCents(total, percent) === Math.round((total * bp) / 10_000);
      }),
    );
  });
});

const bom: BomLine[] = ["pump", "motor", "valve"].map((key, i) => ({
  key,
  item: key,
  quantity: i + 1,
  specification: "",
  rating: { value: 0, unit: "", label: "" },
}));
const priced = (prices: (number | null)[], alternative = -1) =>
  bom.map((l, i) => ({
    key: l.key,
    item: l.item,
    quantity: l.quantity,
    specification: "",
    unitPriceCents: prices[i],
    alternative: i === alternative,
    alternativeDescription: i === alternative ? "other" : "",
  }));
const bid = (id: string, prices: (number | null)[], extra: Partial<ComparedBid> = {}) => comparedBid(id, priced(prices), { specRevision: 2, ...extra });

describe("compareBids", () => {
  it("marks the lowest line totals, and the cheapest offer only among complete ones", () => {
    // "partial" is cheapest overall but leaves the valve unpriced, so "full" is the cheapest complete offer.
    const result = compareBids(bom, 2, [bid("full", [100, 50, 30]), bid("partial", [90, 60, null]), bid("dear", [200, 40, 40], { leadTimeWeeks: 6 })]);
    expect(result.columns.map((c) => c.id)).toEqual(["partial", "full", "dear"]);
    expect(result.cheapestCompleteId).toBe("full");
    expect(result.columns.find((c) => c.id === "partial")).toMatchObject({ complete: false, cheapestComplete: false });
    expect(result.columns.find((c) => c.id === "dear")!.shortestLead).toBe(true);
    const lowest = result.rows.map((r) => r.cells.map((c) => c?.lowest ?? null));
    expect(lowest).toEqual([
      [true, false, false],
      [false, false, true],
      [null, true, false],
    ]);
  });

  it("shows a line priced 0 as included elsewhere, never as the lowest price, and carries each offer's terms and notes", () => {
    const result = compareBids(bom, 2, [
      bid("bundled", [100, 0, 30], {
        offerTerms: { incoterm: "EXW", place: "Leeds", retainerPercent: null, onDeliveryPercent: null, balanceDays: 30, warrantyMonths: 12 },
        notes: "Motor priced with the pump.",
      }),
      bid("itemised", [90, 60, 40]),
      bid("third", [95, 55, 35]),
    ]);
    const motor = result.rows.find((r) => r.key === "motor")!;
    const [bundled, itemised, third] = ["bundled", "itemised", "third"].map((id) => motor.cells[result.columns.findIndex((c) => c.id === id)]!);
    expect(bundled).toMatchObject({ included: true, lowest: false, lineTotalCents: 0 });
    // Among the charged prices (2 × 60 and 2 × 55) the lowest is the third shop's.
    expect([itemised.lowest, third.lowest]).toEqual([false, true]);
    expect(result.columns.find((c) => c.id === "bundled")).toMatchObject({
      delivery: "EXW Leeds (Ex Works, Incoterms 2020)",
      payment: "100 % 30 days after invoice",
      warranty: "12 months warranty",
      notes: "Motor priced with the pump.",
      complete: true,
    });
  });

  it("flags bids on older revisions and keeps their lines that the current bill dropped", () => {
    const old = bid("old", [100, 50, 30], { specRevision: 1 });
    old.lines.push({ key: "cooler", item: "Oil cooler", quantity: 1, specification: "", unitPriceCents: 500, alternative: false, alternativeDescription: "" });
    const result = compareBids(bom, 2, [old, bid("new", [100, 50, 30])], "shop");
    expect(result.columns.map((c) => [c.id, c.olderRevision])).toEqual([
      ["new", false],
      ["old", true],
    ]);
    expect(result.rows.at(-1)).toMatchObject({ key: "cooler", inCurrentBill: false });
    expect(result.rows.at(-1)!.cells[0]).toBeNull();
  });
});
