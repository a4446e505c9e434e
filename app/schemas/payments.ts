import { z } from "zod";
import { PAYMENT_STATUSES } from "~/content/payment-status";
import { parseMoney } from "~/content/money";

// Paying back a retainer: the amount (always typed: an empty field is a mistake, not "all of it")
// and a reason for the record. The first post asks the question with the amount spelled out;
// the second (confirm=yes) carries the person's password and moves the money.
export const refundSchema = z.object({
  amount: z
    .string({ error: "Enter the amount to pay back, e.g. 250 or 250.50." })
    .trim()
    .min(1, "Enter the amount to pay back, e.g. 250 or 250.50.")
    .max(20, "Enter an amount like 250 or 250.50.")
    .transform((v, ctx) => {
      const cents = parseMoney(v);
      if (cents === null) {
        ctx.addIssue({ code: "custom", message: "Enter an amount like 250 or 250.50." });
        return z.NEVER;
      }
      return cents;
    }),
  reason: z.string({ error: "Say why the money goes back." }).trim().min(3, "Say why the money goes back.").max(500, "Keep it under 501 characters."),
  confirm: z.literal("yes").optional(),
});

export const paymentListSchema = z.object({
  status: z.enum(PAYMENT_STATUSES).optional().catch(undefined),
  /** Only payments flagged for a person to check. */
  flagged: z
    .literal("1")
    .optional()
    .catch(undefined)
    .transform((v) => v === "1"),
  page: z.coerce.number().int().min(1).optional().catch(undefined),
});
