// Refunds of a paid charge, whole or in parts, named by the charge or its PaymentIntent. Each
// refund raises the charge's amount_refunded; asking for more than is left is refused.
import type Stripe from "stripe";
import { invalid, missingParam } from "../errors";
import type { EventHub } from "../events";
import { mergeMetadata } from "../params";
import type { ApiRoute } from "../server";
import { newId, unixNow, type Store } from "../store";
import type { Charge, PaymentIntent } from "./payment-intents";

const REASONS = ["duplicate", "fraudulent", "requested_by_customer"] as const;

export function refundRoutes(store: Store, events: EventHub): ApiRoute[] {
  type Refund = ReturnType<typeof newRefund>;
  const newRefund = (charge: Charge, amount: number, reason: (typeof REASONS)[number] | null, metadata: Record<string, string>) =>
    ({
      id: newId("re"),
      object: "refund" as const,
      amount,
      balance_transaction: null,
      charge: charge.id,
      created: unixNow(),
      currency: charge.currency,
      metadata,
      payment_intent: charge.payment_intent,
      reason,
      receipt_number: null,
      source_transfer_reversal: null,
      status: "succeeded" as const,
      transfer_reversal: null,
    }) satisfies Partial<Stripe.Refund>;

  const chargeToRefund = (chargeId: string | undefined, intentId: string | undefined) => {
    if (chargeId && intentId) {
      throw invalid("You may only specify one of these parameters: charge, payment_intent.", { param: "payment_intent" });
    }
    if (chargeId) return store.get<Charge>("charge", chargeId, "charge");
    if (!intentId) throw missingParam("charge");
    const intent = store.get<PaymentIntent>("payment_intent", intentId, "payment_intent");
    if (intent.status !== "succeeded" || !intent.latest_charge) {
      throw invalid(`This PaymentIntent (${intent.id}) does not have a successful charge to refund.`, {
        code: "charge_not_refundable",
        param: "payment_intent",
      });
    }
    return store.get<Charge>("charge", intent.latest_charge);
  };

  return [
    {
      method: "POST",
      pattern: "/v1/refunds",
      handle: ({ params, cause }) => {
        params.allowOnly(["charge", "payment_intent", "amount", "reason", "metadata"]);
        const charge = chargeToRefund(params.text("charge"), params.text("payment_intent"));
        if (charge.status !== "succeeded") {
          throw invalid(`Charge ${charge.id} was not paid, so there is nothing to refund.`, { code: "charge_not_refundable", param: "charge" });
        }
        const left = charge.amount - charge.amount_refunded;
        if (left === 0) {
          throw invalid(`Charge ${charge.id} has already been refunded.`, { code: "charge_already_refunded", param: "charge" });
        }
        const amount = params.integer("amount", { min: 1 }) ?? left;
        if (amount > left) {
          throw invalid(`Refund amount (${amount} ${charge.currency}) is greater than the unrefunded amount on the charge (${left} ${charge.currency}).`, {
            code: "amount_too_large",
            param: "amount",
          });
        }
        const refund = store.add(newRefund(charge, amount, params.oneOf("reason", REASONS) ?? null, mergeMetadata({}, params.metadata())));
        const before = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
        charge.amount_refunded += amount;
        charge.refunded = charge.amount_refunded === charge.amount;
        events.emit("refund.created", refund, cause);
        events.emit("charge.refunded", charge, cause, before);
        return refund;
      },
    },
    { method: "GET", pattern: "/v1/refunds/:id", handle: ({ path }) => store.get("refund", path.id) },
    {
      method: "GET",
      pattern: "/v1/refunds",
      handle: ({ params }) => {
        params.allowOnly(["limit", "starting_after", "ending_before", "created", "charge", "payment_intent"]);
        const [charge, intent] = [params.text("charge"), params.text("payment_intent")];
        return store.list<Refund>(
          "refund",
          "/v1/refunds",
          params,
          (refund) => (charge === undefined || refund.charge === charge) && (intent === undefined || refund.payment_intent === intent),
        );
      },
    },
  ];
}
