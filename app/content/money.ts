// Money, the one home of its rules, shared by server and client: prices are integer cents from
// the first keystroke (so totals never carry floating-point error), typed money is parsed and
// judged here, and the retainer is worked out here. The server always prices again.
import { formatCurrency } from "./number-format";

/** Currencies a spec can be quoted in (ISO 4217 codes); every bid on a spec uses the spec's. */
export const CURRENCIES = ["EUR", "GBP", "USD", "CHF", "SEK", "DKK", "NOK", "PLN", "CZK", "CAD"] as const;
export type Currency = (typeof CURRENCIES)[number];

/** Integer cents as money text in the currency, e.g. 123456 → "€1,234.56". */
export function formatMoney(cents: number, currency: string) {
  return formatCurrency(cents / 100, currency);
}

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

/** Why typed money is not an amount, in words a shop can act on; null when it is fine. */
export function moneyProblem(text: string): string | null {
  const t = text.trim();
  if (parseMoney(t) !== null) return null;
  if (t.startsWith("-")) return "A price can't be negative; enter 0 for a line included elsewhere.";
  if (/^\d+,\d{1,2}$/.test(t)) return `Use a point for decimals: ${t.replace(",", ".")}.`;
  if (/^\d[\d,\s]*\.\d{3,}$/.test(t)) return "At most two decimals (whole cents).";
  if (/[^\d.,\s]/.test(t)) return "Digits only, without a currency sign: e.g. 1250 or 1250.50.";
  return "Enter an amount like 1250 or 1250.50.";
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

const PERCENT = /^(\d{1,3})(?:\.(\d{1,2}))?$/;

/**
 * The retainer in cents: `percent` (a decimal string, at most two places, as PostgreSQL's
 * DECIMAL(5,2) returns it) of `totalCents`, rounded half up to the cent. Worked in hundredths of a
 * percent with BigInt ("12.50" → × 1250 / 10000), so no binary fraction ever rounds it wrong.
 */
export function retainerCents(totalCents: number, percent: string): number {
  if (!Number.isSafeInteger(totalCents) || totalCents < 0) throw new RangeError(`A total must be whole cents, not ${totalCents}.`);
  const match = PERCENT.exec(percent.trim());
  if (!match) throw new RangeError(`"${percent}" is not a percentage with at most two decimals.`);
  const hundredths = BigInt(match[1]) * 100n + BigInt((match[2] ?? "").padEnd(2, "0"));
  if (hundredths > 10_000n) throw new RangeError(`A retainer cannot be more than 100 % (got ${percent}).`);
  return Number((BigInt(totalCents) * hundredths + 5_000n) / 10_000n);
}
