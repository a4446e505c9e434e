// Numbers as the app writes them: en-GB grouping ("12,500.5"). One Intl.NumberFormat per
// precision, made once: `toLocaleString` with options builds a new formatter on every call,
// which was the largest single cost of rendering a design page (thousands of numbers).
const formats = new Map<number, Intl.NumberFormat>();

/** "12,500.25": grouped, at most `maximumFractionDigits` decimals, trailing zeros dropped. */
export function formatNumber(value: number, maximumFractionDigits: number): string {
  let format = formats.get(maximumFractionDigits);
  if (!format) formats.set(maximumFractionDigits, (format = new Intl.NumberFormat("en-GB", { maximumFractionDigits })));
  return format.format(value);
}

const moneyFormats = new Map<string, Intl.NumberFormat>();

/**
 * Money in `currency` by Intl's currency style ("€1,234.56", or "EUR 1,234.56" with `code`), one
 * formatter per currency and style made once, for the same reason as above: a bid comparison
 * writes hundreds of amounts.
 */
export function formatCurrency(amount: number, currency: string, display: "symbol" | "code" = "symbol"): string {
  const key = `${currency} ${display}`;
  let format = moneyFormats.get(key);
  if (!format) moneyFormats.set(key, (format = new Intl.NumberFormat("en-GB", { style: "currency", currency, currencyDisplay: display })));
  return format.format(amount);
}
