import { z } from "zod";
import { MAX_UNIT_PRICE_CENTS, moneyProblem, parseMoney } from "~/content/money";
import { isIsoDay, todayUtc as today } from "~/content/dates";

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

export const bidSchema = z
  .object({
    intent: z.enum(BID_INTENTS),
    lines: z.array(lineSchema).min(1, "The bid has no lines.").max(200),
    leadTimeWeeks: z
      .number({ error: "Enter the lead time in whole weeks." })
      .int("Enter whole weeks.")
      .min(1, "At least 1 week.")
      .max(156, "At most 156 weeks.")
      .optional(),
    validUntil: z.string().refine(isIsoDay, "Enter a real date, e.g. 2026-09-30.").optional(),
    terms: optionalText(4000),
    notes: optionalText(4000),
  })
  .superRefine((bid, ctx) => {
    const submitting = bid.intent === "submit";
    bid.lines.forEach((line, i) => {
      if (line.unitPrice) {
        const cents = parseMoney(line.unitPrice);
        if (cents === null) ctx.addIssue({ code: "custom", path: ["lines", i, "unitPrice"], message: moneyProblem(line.unitPrice)! });
        else if (cents > MAX_UNIT_PRICE_CENTS)
          ctx.addIssue({ code: "custom", path: ["lines", i, "unitPrice"], message: "That is more than a billion; check the amount." });
      } else if (submitting) {
        ctx.addIssue({ code: "custom", path: ["lines", i, "unitPrice"], message: "Price every line before you submit (0 if it is included elsewhere)." });
      }
      if (line.alternative && !line.alternativeDescription) {
        ctx.addIssue({ code: "custom", path: ["lines", i, "alternativeDescription"], message: "Describe the part you offer instead." });
      }
    });
    if (submitting && bid.leadTimeWeeks === undefined) ctx.addIssue({ code: "custom", path: ["leadTimeWeeks"], message: "Enter the lead time in weeks." });
    if (submitting && !bid.validUntil) ctx.addIssue({ code: "custom", path: ["validUntil"], message: "Enter how long the offer is valid." });
    if (bid.validUntil && bid.validUntil <= today()) ctx.addIssue({ code: "custom", path: ["validUntil"], message: "The offer must be valid beyond today." });
  });

export type BidInput = z.output<typeof bidSchema>;

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
