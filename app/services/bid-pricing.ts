// Bid money, pure and shared by the server (which decides) and the bid form (which previews):
// prices are integer cents from the first keystroke, so totals never carry floating-point error.

/** Largest unit price on one line: a billion in the currency. */
export const MAX_UNIT_PRICE_CENTS = 100_000_000_000;

/**
 * Money as typed ("1234.5", "1,234.50", "1 234") to integer cents; null when it is not a
 * plain amount with at most two decimals. A comma is only read as a thousands separator.
 */
export function parseMoney(text: string): number | null {
  let t = text.trim().replace(/[\s\u00a0_]/g, "");
  if (/^\d{1,3}(,\d{3})+(\.\d{0,2})?$/.test(t)) t = t.replace(/,/g, "");
  const m = /^(\d+)(?:\.(\d{0,2}))?$/.exec(t);
  if (!m) return null;
  const cents = Number(m[1]) * 100 + Number((m[2] ?? "").padEnd(2, "0"));
  return Number.isSafeInteger(cents) ? cents : null;
}

/** Cents as a plain amount for an input field: 123450 → "1234.50". */
export const centsToInput = (cents: number) => `${Math.floor(cents / 100)}.${String(cents % 100).padStart(2, "0")}`;

export interface PricedLine {
  quantity: number;
  unitPriceCents: number;
}

export const lineTotalCents = (line: PricedLine) => line.quantity * line.unitPriceCents;

/** The price of one set (the whole bill once) and of every unit wanted. */
export function bidTotals(lines: PricedLine[], units: number) {
  const setTotalCents = lines.reduce((sum, l) => sum + lineTotalCents(l), 0);
  return { setTotalCents, totalCents: setTotalCents * units };
}

/**
 * The retainer owed on an awarded total: `percent` (as stored, e.g. "12.50") of the total,
 * rounded half up to the cent, in integer arithmetic so no floating-point error creeps in.
 */
export function retainerCents(totalCents: number, percent: string): number {
  const m = /^(\d+)(?:\.(\d{1,2}))?$/.exec(percent.trim());
  if (!m) throw new Error(`Not a percentage: ${percent}`);
  const basisPoints = BigInt(m[1]) * 100n + BigInt((m[2] ?? "").padEnd(2, "0"));
  // total × bp / 10 000, half up: (2 × total × bp + 10 000) / 20 000, floored.
  return Number((2n * BigInt(totalCents) * basisPoints + 10_000n) / 20_000n);
}
