import { z } from "zod";
import { PAYMENT_STATUSES } from "~/content/payment-status";
import { parseMoney } from "~/content/money";

// Paying back a retainer: an amount (empty for everything left) and a reason for the record.
export const refundSchema = z.object({
  amount: z
    .string()
    .trim()
    .optional()
    .superRefine((v, ctx) => {
      if (v && parseMoney(v) === null)
        ctx.addIssue({ code: "custom", message: "Enter an amount like 250 or 250.50, or leave it empty to pay back everything left." });
    })
    .transform((v) => (v ? (parseMoney(v) ?? undefined) : undefined)),
  reason: z.string({ error: "Say why the money goes back." }).trim().min(3, "Say why the money goes back.").max(500, "Keep it under 501 characters."),
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
