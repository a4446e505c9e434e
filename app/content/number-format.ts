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
