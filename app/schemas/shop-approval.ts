import { z } from "zod";
import { REFUSAL_REASON_MAX } from "~/content/shop-approval";

const REASON_MISSING = "Say why the shop is refused; the shop reads it.";

/** An admin's decision on a shop waiting for approval. A refusal needs a reason. */
export const shopDecisionSchema = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("approve"), organisationId: z.uuid() }),
  z.object({
    intent: z.literal("refuse"),
    organisationId: z.uuid(),
    reason: z
      .string({ error: REASON_MISSING })
      .trim()
      .min(1, REASON_MISSING)
      .max(REFUSAL_REASON_MAX, `Keep it under ${REFUSAL_REASON_MAX + 1} characters.`),
  }),
]);
