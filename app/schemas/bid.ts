import { z } from "zod";
import { MAX_UNIT_PRICE_CENTS, moneyProblem, parseMoney } from "~/content/money";
import { addDays, isIsoDay, todayUtc as today } from "~/content/dates";
import { EXTRA_ANSWERS, EXTRA_KEYS, INCOTERM_CODES, OFFER_LIMITS, onDeliveryProblem } from "~/content/offer-terms";

// The bid form's schema, shared by the action and the Conform form. A draft may leave prices
// and terms open; a submitted offer prices every line and states lead time and validity.

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `Keep it under ${max + 1} characters.`)
    .optional();

const lineSchema = z.object({
  key: z.string().min(1).max(60),
  unitPrice: z.string().trim().max(30, "Enter an amount like 1250.00.").optional(),
  alternative: z.boolean().optional(),
  alternativeDescription: optionalText(500),
});

const BID_INTENTS = ["save", "submit"] as const;

const wholeNumber = (what: string, min: number, max: number) =>
  z
    .number({ error: `Enter ${what} as a whole number.` })
    .int(`Enter ${what} as a whole number.`)
    .min(min, `At least ${min}.`)
    .max(max, `At most ${max}.`)
    .optional();

/** A money field: text, judged by the money rules in superRefine (so a typo keeps what was typed). */
const moneyText = z.string().trim().max(30, "Enter an amount like 1250.00.").optional();

const extraSchema = z.object({
  kind: z.enum(EXTRA_KEYS),
  // Open until the shop answers: a draft may leave it so, a submitted offer may not.
  answer: z.enum(EXTRA_ANSWERS, { error: "Choose priced, included or not offered." }).optional(),
  price: moneyText,
});

const ownLineSchema = z.object({ name: optionalText(OFFER_LIMITS.ownLineName), price: moneyText });

const alternativeLineSchema = z.object({
  name: optionalText(OFFER_LIMITS.ownLineName),
  quantity: wholeNumber("the quantity", 1, 999),
  price: moneyText,
});

const INCOTERM_ERROR = `Choose one of the Incoterms 2020 rules: ${INCOTERM_CODES.join(", ")}.`;

const bidFields = z.object({
  intent: z.enum(BID_INTENTS),
  lines: z.array(lineSchema).min(1, "The bid has no lines.").max(200),
  leadTimeWeeks: z
    .number({ error: "Enter the lead time in whole weeks." })
    .int("Enter whole weeks.")
    .min(1, "At least 1 week.")
    .max(156, "At most 156 weeks.")
    .optional(),
  validUntil: z.string().refine(isIsoDay, "Enter a real date, e.g. 2026-09-30.").optional(),
  validDays: wholeNumber("the days", 1, 365),
  extras: z.array(extraSchema).max(EXTRA_KEYS.length).optional(),
  ownLines: z.array(ownLineSchema).max(OFFER_LIMITS.ownLines, `At most ${OFFER_LIMITS.ownLines} lines of your own.`).optional(),
  incoterm: z.enum(INCOTERM_CODES, { error: INCOTERM_ERROR }).optional(),
  place: optionalText(OFFER_LIMITS.place),
  onDeliveryPercent: wholeNumber("the percentage", 0, 100),
  balanceDays: wholeNumber("the days", 0, 365),
  warrantyMonths: wholeNumber("the months", 0, 120),
  alternativeDescription: optionalText(OFFER_LIMITS.description),
  alternativeLines: z
    .array(alternativeLineSchema)
    .max(OFFER_LIMITS.alternativeLines, `At most ${OFFER_LIMITS.alternativeLines} lines in the alternative circuit.`)
    .optional(),
  notes: optionalText(4000),
});

/**
 * The bid form's schema on a spec whose retainer is `retainerPercent`: the share with the order,
 * paid through the portal, so the shop states only the share on delivery and when the rest is due.
 */
export const bidSchemaFor = (retainerPercent: number) =>
  bidFields.superRefine((bid, ctx) => {
    const submitting = bid.intent === "submit";
    bid.lines.forEach((line, i) => {
      checkPrice(ctx, ["lines", i, "unitPrice"], line.unitPrice, submitting ? "Price every line before you submit (0 if it is included elsewhere)." : null);
      if (line.alternative && !line.alternativeDescription) {
        ctx.addIssue({ code: "custom", path: ["lines", i, "alternativeDescription"], message: "Describe the part you offer instead." });
      }
    });
    if (submitting && bid.leadTimeWeeks === undefined) ctx.addIssue({ code: "custom", path: ["leadTimeWeeks"], message: "Enter the lead time in weeks." });
    if (bid.validUntil && bid.validDays !== undefined)
      ctx.addIssue({ code: "custom", path: ["validDays"], message: "Give a date or a number of days, not both." });
    if (submitting && !bid.validUntil && bid.validDays === undefined)
      ctx.addIssue({ code: "custom", path: ["validUntil"], message: "Enter how long the offer is valid: a date, or a number of days." });
    if (bid.validUntil && bid.validUntil <= today()) ctx.addIssue({ code: "custom", path: ["validUntil"], message: "The offer must be valid beyond today." });
    checkOfferExtras(bid, ctx, submitting);
    checkPayment(bid, ctx, submitting, retainerPercent);
  });

const UNANSWERED = "Choose priced, included or not offered before you submit.";
const UNANSWERED_KINDS = `Answer every kind of work beyond the bill (${EXTRA_KEYS.length}) before you submit: priced, included or not offered.`;

const issue = (ctx: z.RefinementCtx, path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });

/** A typed price: readable, not negative, within a billion; `required` when it must be there. */
function checkPrice(ctx: z.RefinementCtx, path: (string | number)[], text: string | undefined, required: string | null) {
  if (!text) {
    if (required) issue(ctx, path, required);
    return;
  }
  const cents = parseMoney(text);
  if (cents === null) issue(ctx, path, moneyProblem(text)!);
  else if (cents > MAX_UNIT_PRICE_CENTS) issue(ctx, path, "That is more than a billion; check the amount.");
}

type BidFields = z.output<typeof bidFields>;

/** The work beyond the bill, the structured terms and the alternative circuit. */
function checkOfferExtras(bid: BidFields, ctx: z.RefinementCtx, submitting: boolean) {
  const kinds = new Set<string>();
  bid.extras?.forEach((extra, i) => {
    if (kinds.has(extra.kind)) issue(ctx, ["extras", i, "kind"], "This kind of work is listed twice.");
    kinds.add(extra.kind);
    if (extra.answer === "priced") checkPrice(ctx, ["extras", i, "price"], extra.price, "Enter the price, or choose included or not offered.");
    if (submitting && !extra.answer) issue(ctx, ["extras", i, "answer"], UNANSWERED);
  });
  // A kind left out of the post is as unanswered as one left open: the buyer must not read "not offered" into it.
  if (submitting && EXTRA_KEYS.some((k) => !kinds.has(k))) issue(ctx, ["extras"], UNANSWERED_KINDS);
  bid.ownLines?.forEach((line, i) => {
    if (!line.name && !line.price) return; // an empty row of the form
    if (!line.name) issue(ctx, ["ownLines", i, "name"], "Name the line.");
    checkPrice(ctx, ["ownLines", i, "price"], line.price, "Enter the price (0 if included).");
  });
  if (bid.incoterm && !bid.place) issue(ctx, ["place"], `Name the place for ${bid.incoterm}, e.g. the town of your works.`);
  if (submitting && !bid.incoterm) issue(ctx, ["incoterm"], "Choose the delivery terms (an Incoterms 2020 rule).");
  if (submitting && bid.warrantyMonths === undefined) issue(ctx, ["warrantyMonths"], "Enter the warranty in months (0 for none).");
  const altLines = (bid.alternativeLines ?? []).map((l, i) => [l, i] as const).filter(([l]) => l.name || l.price || l.quantity !== undefined);
  if (altLines.length && !bid.alternativeDescription) issue(ctx, ["alternativeDescription"], "Describe the circuit you propose instead, and how it differs.");
  if (bid.alternativeDescription && !altLines.length) issue(ctx, ["alternativeDescription"], "Price the alternative circuit: add at least one line.");
  for (const [line, i] of altLines) {
    if (!line.name) issue(ctx, ["alternativeLines", i, "name"], "Name the part.");
    if (line.quantity === undefined) issue(ctx, ["alternativeLines", i, "quantity"], "Enter the quantity.");
    checkPrice(ctx, ["alternativeLines", i, "price"], line.price, "Enter the unit price.");
  }
}

/** The share on delivery beside the retainer, and when the rest is due. */
function checkPayment(bid: BidFields, ctx: z.RefinementCtx, submitting: boolean, retainerPercent: number) {
  const problem = onDeliveryProblem(retainerPercent, bid.onDeliveryPercent);
  const upFront = retainerPercent + (bid.onDeliveryPercent ?? 0);
  if (problem) issue(ctx, ["onDeliveryPercent"], problem);
  else if (submitting && upFront < 100 && bid.balanceDays === undefined)
    issue(ctx, ["balanceDays"], `Say when the remaining ${100 - upFront} % is due: days after invoice (0 for on invoice).`);
}

/** The day an offer is valid until: the date given, or today plus the days given. */
export const validUntilOf = (bid: Pick<BidInput, "validUntil" | "validDays">) =>
  bid.validUntil ?? (bid.validDays !== undefined ? addDays(today(), bid.validDays) : undefined);

export type BidInput = z.output<ReturnType<typeof bidSchemaFor>>;

const LINE_FIELD = /^lines\[(\d+)\]\.(key|unitPrice|alternative|alternativeDescription)$/;

/**
 * Whether the posted lines are the bill's lines, one each, in its order (`lines[i].key` is the
 * bill's i-th key). Anything else (more lines than the bill, a gap, `lines` as a single value)
 * comes from a stale or forged form and is refused whole before it is parsed or shown again.
 */
export function linesMatchBill(posted: Iterable<[string, unknown]>, billKeys: readonly string[]) {
  const keys = new Map<number, unknown>();
  for (const [name, value] of posted) {
    if (!name.startsWith("lines")) continue;
    const match = LINE_FIELD.exec(name);
    if (!match || Number(match[1]) >= billKeys.length) return false;
    if (match[2] === "key") keys.set(Number(match[1]), value);
  }
  return keys.size === billKeys.length && billKeys.every((key, i) => keys.get(i) === key);
}

export const awardSchema = z.object({
  bidId: z.string().uuid("Choose a bid."),
  confirm: z.literal("on", { error: "Tick the box to confirm the award." }),
});
