// Currencies a spec can be quoted in (ISO 4217 codes); every bid on a spec uses the spec's.
export const CURRENCIES = ["EUR", "GBP", "USD", "CHF", "SEK", "DKK", "NOK", "PLN", "CZK", "CAD"] as const;
export type Currency = (typeof CURRENCIES)[number];

/** Integer cents as money text in the currency, e.g. 123456 → "€1,234.56". */
export function formatMoney(cents: number, currency: string) {
  return new Intl.NumberFormat("en-GB", { style: "currency", currency }).format(cents / 100);
}
