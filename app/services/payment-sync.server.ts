import Stripe from "stripe";
import { QueryTypes } from "sequelize";
import { Job, Payment, sequelize } from "~/models/index.server";
import { OPEN_PAYMENT_STATUSES } from "~/models/payment.server";
import { settleCompletedSession } from "./retainer-settlement.server";
import { isPaid } from "./balance.server";
import { isMissingAtStripe, stripe } from "./stripe.server";

// Asking Stripe, not the clock, what became of a payment's Checkout Session, and acting on the
// answer: the buyer's "pay" click and the periodic reconciler both come here. A paid session is
// recorded through the webhook's own path (settleCompletedSession), so a webhook arriving later
// changes nothing; an expired session, or one Stripe no longer knows, ends the attempt so the
// next click starts afresh.

export type CheckoutState =
  | { kind: "open"; session: Stripe.Checkout.Session }
  /** The session completed: recorded (or found wanting and flagged) through the webhook's path. */
  | { kind: "completed"; outcome: string }
  /** Expired, or unknown to Stripe: the payment is now "expired". */
  | { kind: "closed" };

/** Ends an attempt that can no longer take a card, unless a webhook settled it meanwhile. */
async function closePayment(paymentId: string) {
  await Payment.update({ status: "expired" }, { where: { id: paymentId, status: [...OPEN_PAYMENT_STATUSES] } });
}

/** When the card was charged: the charge's time where Stripe gives it, else now. */
function paidAtOf(session: Stripe.Checkout.Session) {
  const intent = session.payment_intent;
  const charge = typeof intent === "object" && intent ? intent.latest_charge : null;
  return typeof charge === "object" && charge ? new Date(charge.created * 1000) : new Date();
}

/** What Stripe says of the payment's session, acted upon. Other Stripe errors are thrown. */
export async function syncPayment(payment: Payment): Promise<CheckoutState> {
  if (!payment.checkoutSessionId) throw new Error(`Payment ${payment.id} has no Checkout Session to ask about.`);
  let session: Stripe.Checkout.Session;
  try {
    session = await stripe().checkout.sessions.retrieve(payment.checkoutSessionId, { expand: ["payment_intent.latest_charge"] });
  } catch (error) {
    if (!isMissingAtStripe(error)) throw error;
    await closePayment(payment.id);
    return { kind: "closed" };
  }
  if (session.status === "open") return { kind: "open", session };
  if (session.status === "complete") {
    const outcome = await sequelize.transaction(async (transaction) => {
      const locked = await Payment.findByPk(payment.id, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
      return settleCompletedSession(transaction, locked, session, paidAtOf(session));
    });
    return { kind: "completed", outcome };
  }
  await closePayment(payment.id);
  return { kind: "closed" };
}

/**
 * Expires the payment's open session at Stripe, so no old tab can pay it, then asks again: a
 * payer who completed it a moment before gets their payment recorded rather than lost.
 */
export async function retireCheckout(payment: Payment): Promise<CheckoutState> {
  try {
    await stripe().checkout.sessions.expire(payment.checkoutSessionId!);
  } catch (error) {
    // Only an open session can be expired: this one completed or expired meanwhile.
    if (!(error instanceof Stripe.errors.StripeInvalidRequestError)) throw error;
  }
  return syncPayment(payment);
}

/** An open payment counts as forgotten after this long without a webhook. */
const RECONCILE_AFTER_MS = 5 * 60_000;

/**
 * Asks Stripe about every payment left open for a while (a scheduled job, every minute: see
 * background-work.server.ts). Rows are claimed by stamping `checked_at` under FOR UPDATE SKIP
 * LOCKED, so runs that overlap each take different payments, and a payment is asked about at
 * most once per period. Returns what
 * happened to each claimed payment.
 */
export async function reconcileOpenPayments({ olderThanMs = RECONCILE_AFTER_MS, limit = 50 } = {}): Promise<Record<string, string>> {
  const cutoff = new Date(Date.now() - olderThanMs);
  const claimed = await sequelize.query<{ id: string }>(
    `UPDATE payments SET checked_at = :now
     WHERE id IN (SELECT id FROM payments
                  WHERE status IN ('pending', 'failed') AND created_at < :cutoff AND (checked_at IS NULL OR checked_at < :cutoff)
                  ORDER BY checked_at NULLS FIRST, created_at LIMIT :limit FOR UPDATE SKIP LOCKED)
     RETURNING id`,
    { replacements: { now: new Date(), cutoff, limit }, type: QueryTypes.SELECT },
  );
  const outcomes: Record<string, string> = {};
  for (const { id } of claimed) {
    try {
      outcomes[id] = await reconcileOne(id);
    } catch (error) {
      // The card service did not answer: the payment is asked about again next period.
      outcomes[id] = `not reached: ${error instanceof Error ? error.message : String(error)}`;
    }
  }
  return outcomes;
}

async function reconcileOne(id: string): Promise<string> {
  const payment = await Payment.findByPk(id);
  if (!payment || !(OPEN_PAYMENT_STATUSES as readonly string[]).includes(payment.status)) return "settled meanwhile";
  // A row without a session: the click that made it never got one, so nobody can pay it.
  if (!payment.checkoutSessionId) {
    await closePayment(id);
    return "expired: no session was made";
  }
  let state = await syncPayment(payment);
  if (state.kind === "open") {
    // The job was paid through another attempt: this session must not take a second charge.
    const job = await Job.findByPk(payment.jobId, { rejectOnEmpty: true });
    if (!isPaid(job, payment.purpose)) return "still open";
    state = await retireCheckout(payment);
  }
  return state.kind === "completed" ? state.outcome : "expired";
}
