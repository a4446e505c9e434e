import type Stripe from "stripe";
import { QueryTypes, type Transaction } from "sequelize";
import { Job, JobEvent, Payment, Refund, Spec, StripeEvent, User, sequelize } from "~/models/index.server";
import { formatMoney } from "~/content/currencies";
import { env } from "~/env.server";
import { enqueueMail } from "./mail.server";
import { recordRetainerReceived } from "./jobs.server";
import { sendReceipts } from "./payments.server";

// Stripe's webhook events, each applied once. The event id is the primary key of
// stripe_events, inserted in the same transaction as the change the event makes: a replay (or a
// second delivery racing the first) inserts nothing and changes nothing.

const idOf = (value: string | { id: string } | null | undefined) => (typeof value === "string" ? value : (value?.id ?? null));

async function paymentFor(transaction: Transaction, ref: { paymentId?: string | null; sessionId?: string | null; paymentIntentId?: string | null }) {
  const where = ref.sessionId ? { checkoutSessionId: ref.sessionId } : ref.paymentIntentId ? { paymentIntentId: ref.paymentIntentId } : null;
  const byStripeId = where ? await Payment.findOne({ where, lock: transaction.LOCK.UPDATE, transaction }) : null;
  if (byStripeId) return byStripeId;
  // Our own id travels in the metadata; it is only trusted when it names a real row.
  const uuid = ref.paymentId && /^[0-9a-f-]{36}$/i.test(ref.paymentId) ? ref.paymentId : null;
  return uuid ? Payment.findByPk(uuid, { lock: transaction.LOCK.UPDATE, transaction }) : null;
}

async function sessionCompleted(session: Stripe.Checkout.Session, event: Stripe.Event, transaction: Transaction) {
  const payment = await paymentFor(transaction, { sessionId: session.id, paymentId: session.metadata?.payment_id });
  if (!payment) return `no payment for session ${session.id}`;
  if (session.payment_status !== "paid") return `session ${session.id} completed unpaid (${session.payment_status})`;
  if (["paid", "refunded", "partially_refunded"].includes(payment.status)) return "payment already recorded";
  if (session.amount_total !== null && session.amount_total !== payment.amountCents) return `amount ${session.amount_total} differs from ${payment.amountCents}; not applied`;
  const paidAt = new Date(event.created * 1000);
  await payment.update({ status: "paid", paidAt, paymentIntentId: idOf(session.payment_intent), failureMessage: null }, { transaction });
  await recordRetainerReceived(transaction, { jobId: payment.jobId, paidById: payment.createdById, paidAt, paymentId: payment.id, amountCents: payment.amountCents, currency: payment.currency });
  await sendReceipts(transaction, payment);
  return "paid";
}

async function paymentFailed(intent: Stripe.PaymentIntent, transaction: Transaction) {
  const payment = await paymentFor(transaction, { paymentIntentId: intent.id, paymentId: intent.metadata?.payment_id });
  if (!payment) return `no payment for payment intent ${intent.id}`;
  if (payment.status !== "pending" && payment.status !== "failed") return `payment is ${payment.status}; failure ignored`;
  const message = intent.last_payment_error?.message ?? "The card was declined.";
  await payment.update({ status: "failed", failureMessage: message, paymentIntentId: payment.paymentIntentId ?? intent.id }, { transaction });
  return "declined";
}

async function chargeRefunded(charge: Stripe.Charge, transaction: Transaction) {
  const payment = await paymentFor(transaction, { paymentIntentId: idOf(charge.payment_intent), paymentId: charge.metadata?.payment_id });
  if (!payment) return `no payment for charge ${charge.id}`;
  const refunded = charge.amount_refunded;
  if (refunded <= payment.refundedCents) return "refund already recorded";
  const newly = refunded - payment.refundedCents;
  await payment.update({ refundedCents: refunded, status: refunded >= payment.amountCents ? "refunded" : "partially_refunded" }, { transaction });
  // Our requested refunds, oldest first, are recorded as far as Stripe's refunded sum reaches.
  let covered = Number((await Refund.sum("amountCents", { where: { paymentId: payment.id, status: "recorded" }, transaction })) ?? 0);
  const waiting = await Refund.findAll({ where: { paymentId: payment.id, status: "requested" }, order: [["createdAt", "ASC"]], transaction });
  for (const refund of waiting) {
    if (covered + refund.amountCents > refunded) break;
    covered += refund.amountCents;
    await refund.update({ status: "recorded", recordedAt: new Date() }, { transaction });
  }
  const job = await Job.findByPk(payment.jobId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  await job.update({ retainerRefundedCents: job.retainerRefundedCents + newly }, { transaction });
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const by = waiting[0]?.requestedById ?? payment.createdById;
  await JobEvent.create({ jobId: job.id, userId: by, kind: "retainer_refunded", milestone: null, detail: { paymentId: payment.id, amountCents: newly, currency: payment.currency } }, { transaction });
  const payer = await User.findByPk(payment.createdById, { transaction });
  if (payer?.active) {
    await enqueueMail(
      {
        to: payer.email,
        subject: `Refund of ${formatMoney(newly, payment.currency)} on your retainer for ${spec.title}`,
        text: `Hello ${payer.name},\n\n${formatMoney(newly, payment.currency)} of the retainer you paid has been refunded to your card. Refunded so far: ${formatMoney(refunded, payment.currency)} of the ${formatMoney(payment.amountCents, payment.currency)} you paid. It can take a few days to appear on your statement.\n\nThe job: ${env().APP_URL}/jobs/${job.id}\n`,
      },
      transaction,
    );
  }
  for (const person of await User.findAll({ where: { organisationId: job.shopOrganisationId, active: true }, transaction })) {
    await enqueueMail(
      {
        to: person.email,
        subject: `Retainer paid back in ${refunded >= payment.amountCents ? "full" : "part"}: ${spec.title}`,
        text: `Hello ${person.name},

Tenderflow has refunded ${formatMoney(newly, payment.currency)} of the buyer's retainer for "${spec.title}" (${formatMoney(refunded, payment.currency)} of ${formatMoney(payment.amountCents, payment.currency)} refunded so far). Your account manager will be in touch about the job.

The job: ${env().APP_URL}/jobs/${job.id}
`,
      },
      transaction,
    );
  }
  return `refunded ${newly}`;
}

async function sessionExpired(session: Stripe.Checkout.Session, transaction: Transaction) {
  const payment = await paymentFor(transaction, { sessionId: session.id, paymentId: session.metadata?.payment_id });
  if (!payment) return `no payment for session ${session.id}`;
  if (payment.status !== "pending" && payment.status !== "failed") return `payment is ${payment.status}; expiry ignored`;
  await payment.update({ status: "expired" }, { transaction });
  return "expired";
}

async function apply(event: Stripe.Event, transaction: Transaction): Promise<string> {
  switch (event.type) {
    case "checkout.session.completed":
      return sessionCompleted(event.data.object, event, transaction);
    case "checkout.session.expired":
      return sessionExpired(event.data.object, transaction);
    case "payment_intent.payment_failed":
      return paymentFailed(event.data.object, transaction);
    case "charge.refunded":
      return chargeRefunded(event.data.object, transaction);
    default:
      return "not used";
  }
}

/** Applies a verified event once; says what it did ("replay" when it had been seen). */
export async function handleStripeEvent(event: Stripe.Event): Promise<string> {
  return sequelize.transaction(async (transaction) => {
    const inserted = await sequelize.query<{ id: string }>(
      `INSERT INTO stripe_events (id, type, outcome, payload) VALUES (:id, :type, 'received', :payload) ON CONFLICT (id) DO NOTHING RETURNING id`,
      { replacements: { id: event.id, type: event.type, payload: JSON.stringify(event) }, transaction, type: QueryTypes.SELECT },
    );
    if (inserted.length === 0) return "replay";
    const outcome = await apply(event, transaction);
    if (outcome.startsWith("no payment")) console.warn(`Stripe event ${event.id} (${event.type}): ${outcome}`);
    await StripeEvent.update({ outcome: outcome.slice(0, 200) }, { where: { id: event.id }, transaction });
    return outcome;
  });
}
