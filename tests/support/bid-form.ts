// The bid form as a shop's browser posts it, for integration tests of the bid route.
import type { BomLine } from "~/hydraulics";
import { EXTRA_KEYS } from "~/content/offer-terms";
import * as bidRoute from "~/routes/spec-bid";
import { inDays } from "./factories";
import type { Visitor } from "./routes";

/** Structured terms every submitted offer states: ex works Leeds, 30 days net, a year's warranty. */
export const TERMS = { incoterm: "EXW", place: "Leeds works", balanceDays: "30", warrantyMonths: "12" };

/** Every kind of work beyond the bill answered "not offered", as a submitted offer must answer each. */
export const NO_EXTRAS = Object.fromEntries(
  EXTRA_KEYS.flatMap((kind, i) => [
    [`extras[${i}].kind`, kind],
    [`extras[${i}].answer`, "not_offered"],
  ]),
);

/** The bid form's fields: every line priced at `price(line, i)` unless it returns null. */
export function bidFields(bom: BomLine[], price: (line: BomLine, i: number) => string | null, extra: Record<string, string> = {}) {
  const fields: Record<string, string> = { leadTimeWeeks: "12", validUntil: inDays(40), ...TERMS, notes: "", ...NO_EXTRAS, ...extra };
  bom.forEach((line, i) => {
    fields[`lines[${i}].key`] = line.key;
    const p = price(line, i);
    if (p !== null) fields[`lines[${i}].unitPrice`] = p;
  });
  return fields;
}

export const postBid = (visitor: Visitor, specId: string, fields: Record<string, string>) =>
  visitor.post(bidRoute.action, `/specs/${specId}/bid`, fields, { specId });
