// The words of a refund's confirmation, shared by the server (which asks) and the page.
import { formatCurrency } from "./number-format";

/** An amount with its currency's code, as a question about money spells it: "EUR 1,250.00". */
export const spelledMoney = (cents: number, currency: string) => formatCurrency(cents / 100, currency, "code").replace(/\u00a0/g, " ");

export function refundQuestionText(r: { amountCents: number; paidCents: number; currency: string; what: string; to: string }) {
  return `Refund ${spelledMoney(r.amountCents, r.currency)} of the ${spelledMoney(r.paidCents, r.currency)} ${r.what} to ${r.to}?`;
}
