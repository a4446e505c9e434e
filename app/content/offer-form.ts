// The bid form's values beyond the bill: what a saved offer fills in, and what the typed form
// adds up to for the live preview (the server prices everything again from what is sent).
import { centsToInput, parseMoney } from "./money";
import { EXTRA_ANSWERS, EXTRA_KEYS, NO_TERMS, type AlternativeCircuit, type ExtraAnswer, type OfferExtra, type OfferTerms, type OwnLine } from "./offer-terms";

const numberText = (n: number | null) => (n === null ? "" : String(n));

/** The form's starting values from a saved offer (or none): every kind of work, the terms, the alternative. */
export function offerDefaults(
  bid: { extras: OfferExtra[]; ownLines: OwnLine[]; offerTerms: OfferTerms | null; alternativeCircuit: AlternativeCircuit | null } | null,
) {
  const terms = bid?.offerTerms ?? NO_TERMS;
  const alternative = bid?.alternativeCircuit;
  return {
    // A kind not answered yet starts open (""), never as "not offered": the shop must say.
    extras: EXTRA_KEYS.map((kind) => {
      const saved = bid?.extras.find((e) => e.kind === kind);
      return { kind, answer: saved?.answer ?? "", price: saved?.priceCents == null ? "" : centsToInput(saved.priceCents) };
    }),
    ownLines: (bid?.ownLines ?? []).map((l) => ({ name: l.name, price: centsToInput(l.priceCents) })),
    incoterm: terms.incoterm ?? "",
    place: terms.place,
    onDeliveryPercent: numberText(terms.onDeliveryPercent),
    balanceDays: numberText(terms.balanceDays),
    warrantyMonths: numberText(terms.warrantyMonths),
    alternativeDescription: alternative?.description ?? "",
    alternativeLines: alternative
      ? alternative.lines.map((l) => ({ name: l.name, quantity: String(l.quantity), price: centsToInput(l.unitPriceCents) }))
      : [{ name: "", quantity: "", price: "" }],
  };
}

type Typed = { extras?: unknown; ownLines?: unknown } | undefined;
const rows = (value: unknown) => (Array.isArray(value) ? (value as Record<string, unknown>[]) : []).filter(Boolean);
const text = (value: unknown) => (typeof value === "string" ? value : "");

/** The kinds of work as typed so far; an unreadable price counts as nothing until corrected. */
export function typedExtras(form: Typed): OfferExtra[] {
  return rows(form?.extras).flatMap((row) => {
    const kind = EXTRA_KEYS.find((k) => k === row.kind);
    const answer = EXTRA_ANSWERS.find((a) => a === row.answer) as ExtraAnswer | undefined;
    return kind && answer ? [{ kind, answer, priceCents: answer === "priced" ? (parseMoney(text(row.price)) ?? 0) : null }] : [];
  });
}

/** The shop's own lines as typed so far. */
export function typedOwnLines(form: Typed): OwnLine[] {
  return rows(form?.ownLines).map((row) => ({ name: text(row.name), priceCents: parseMoney(text(row.price)) ?? 0 }));
}
