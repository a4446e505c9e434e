import type Stripe from "stripe";
import { QueryTypes, type Transaction } from "sequelize";
import { z } from "zod";
import { Job, JobEvent, Payment, Refund, Spec, StripeEvent, User, sequelize } from "~/models/index.server";
import { enqueueMail } from "./mail.server";
import { refundToPayerMail, refundToShopMail } from "./mail-templates.server";
import { recordAudit, refundSubject } from "./audit.server";
import { flagPayment, idOf, moneyMismatch, settleCompletedSession } from "./retainer-settlement.server";

// Stripe's webhook events, each applied once. The event id is the primary key of
// stripe_events, inserted in the same transaction as the change the event makes: a replay (or a
// second delivery racing the first) inserts nothing and changes nothing.
// A signed event is still checked against our payment (amount, currency, refund no larger than
// the charge): one that does not match is recorded with its reason, flags the payment for a
// person and changes nothing else; it is answered 200 like any other, so Stripe stops sending it.

const stripeRef = z.union([z.string(), z.object({ id: z.string() }).loose()]).nullish();
const metadata = z.record(z.string(), z.unknown()).nullish();
const sessionShape = z
  .object({
    id: z.string(),
    metadata,
    payment_status: z.string().nullish(),
    amount_total: z.unknown().optional(),
    currency: z.unknown().optional(),
    payment_intent: stripeRef,
  })
  .loose();
const intentShape = z.object({ id: z.string(), metadata, last_payment_error: z.object({ message: z.string().nullish() }).loose().nullish() }).loose();
const chargeShape = z
  .object({
    id: z.string(),
    metadata,
    payment_intent: stripeRef,
    amount: z.unknown().optional(),
    amount_refunded: z.unknown().optional(),
    currency: z.unknown().optional(),
  })
  .loose();

const paymentIdIn = (data: z.infer<typeof metadata>) => (typeof data?.payment_id === "string" ? data.payment_id : null);

async function paymentFor(transaction: Transaction, ref: { paymentId?: string | null; sessionId?: string | null; paymentIntentId?: string | null }) {
  const where = ref.sessionId ? { checkoutSessionId: ref.sessionId } : ref.paymentIntentId ? { paymentIntentId: ref.paymentIntentId } : null;
  const byStripeId = where ? await Payment.findOne({ where, lock: transaction.LOCK.UPDATE, transaction }) : null;
  if (byStripeId) return byStripeId;
  // Our own id travels in the metadata; it is only trusted when it names a real row.
  const uuid = ref.paymentId && /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(ref.paymentId) ? ref.paymentId : null;
  return uuid ? Payment.findByPk(uuid, { lock: transaction.LOCK.UPDATE, transaction }) : null;
}

async function sessionCompleted(session: z.infer<typeof sessionShape>, event: Stripe.Event, transaction: Transaction) {
  const payment = await paymentFor(transaction, { sessionId: session.id, paymentId: paymentIdIn(session.metadata) });
  if (!payment) return `no payment for session ${session.id}`;
  const created = typeof event.created === "number" ? new Date(event.created * 1000) : new Date();
  return settleCompletedSession(transaction, payment, session, Number.isNaN(created.getTime()) ? new Date() : created);
}

async function paymentFailed(intent: z.infer<typeof intentShape>, transaction: Transaction) {
  const payment = await paymentFor(transaction, { paymentIntentId: intent.id, paymentId: paymentIdIn(intent.metadata) });
  if (!payment) return `no payment for payment intent ${intent.id}`;
  if (payment.status !== "pending" && payment.status !== "failed") return `payment is ${payment.status}; failure ignored`;
  const message = (intent.last_payment_error?.message ?? "The card was declined.").slice(0, 500);
  await payment.update({ status: "failed", failureMessage: message, paymentIntentId: payment.paymentIntentId ?? intent.id }, { transaction });
  return "declined";
}

/** Why a charge.refunded event cannot be true of this payment, or null. */
function refundMismatch(payment: Payment, charge: z.infer<typeof chargeShape>) {
  const money = moneyMismatch(payment, charge.amount, charge.currency);
  if (money) return money;
  const refunded = charge.amount_refunded;
  if (typeof refunded !== "number" || !Number.isSafeInteger(refunded) || refunded < 0) return "no refunded amount";
  if (refunded > payment.amountCents) return `refunded ${refunded}, more than the ${payment.amountCents} paid`;
  return null;
}

async function chargeRefunded(charge: z.infer<typeof chargeShape>, transaction: Transaction) {
  const payment = await paymentFor(transaction, { paymentIntentId: idOf(charge.payment_intent), paymentId: paymentIdIn(charge.metadata) });
  if (!payment) return `no payment for charge ${charge.id}`;
  const mismatch = refundMismatch(payment, charge);
  if (mismatch) {
    await flagPayment(
      transaction,
      payment,
      `A refund event for charge ${charge.id} said ${mismatch}; it was not applied. Check the payment at the card service.`,
    );
    return `refund: ${mismatch}; not applied`;
  }
  const refunded = charge.amount_refunded as number;
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
    await recordAudit({ actor: "system", action: "refund-settled", subject: refundSubject(refund, payment) }, transaction);
  }
  // A second charge paid back is not the job's retainer: the job and the shop are left alone.
  if (payment.duplicate) return `refunded ${newly} of a second charge`;
  // A balance paid back is recorded in the job's history; the retainer's figures stay.
  if (payment.purpose === "balance") {
    await JobEvent.create(
      {
        jobId: payment.jobId,
        userId: waiting[0]?.requestedById ?? payment.createdById,
        kind: "balance_refunded",
        milestone: null,
        detail: { paymentId: payment.id, amountCents: newly, currency: payment.currency },
      },
      { transaction },
    );
    return `refunded ${newly} of a balance`;
  }
  const job = await Job.findByPk(payment.jobId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  await job.update({ retainerRefundedCents: job.retainerRefundedCents + newly }, { transaction });
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const by = waiting[0]?.requestedById ?? payment.createdById;
  await JobEvent.create(
    {
      jobId: job.id,
      userId: by,
      kind: "retainer_refunded",
      milestone: null,
      detail: { paymentId: payment.id, amountCents: newly, currency: payment.currency },
    },
    { transaction },
  );
  const retainer = {
    specTitle: spec.title,
    jobId: job.id,
    amountCents: payment.amountCents,
    currency: payment.currency,
    newlyCents: newly,
    refundedCents: refunded,
  };
  const payer = await User.findByPk(payment.createdById, { transaction });
  if (payer?.active) {
    await enqueueMail({ to: payer.email, ...refundToPayerMail({ ...retainer, name: payer.name }) }, transaction);
  }
  for (const person of await User.findAll({ where: { organisationId: job.shopOrganisationId, active: true }, transaction })) {
    await enqueueMail({ to: person.email, ...refundToShopMail({ ...retainer, name: person.name }) }, transaction);
  }
  return `refunded ${newly}`;
}

async function sessionExpired(session: z.infer<typeof sessionShape>, transaction: Transaction) {
  const payment = await paymentFor(transaction, { sessionId: session.id, paymentId: paymentIdIn(session.metadata) });
  if (!payment) return `no payment for session ${session.id}`;
  if (payment.status !== "pending" && payment.status !== "failed") return `payment is ${payment.status}; expiry ignored`;
  await payment.update({ status: "expired" }, { transaction });
  return "expired";
}

/** Runs `handle` on the event's object when it has the fields we read; otherwise says what is missing. */
function withShape<S extends z.ZodType>(shape: S, event: Stripe.Event, handle: (object: z.infer<S>) => Promise<string>) {
  const parsed = shape.safeParse((event.data as { object?: unknown } | undefined)?.object);
  if (parsed.success) return handle(parsed.data);
  const issue = parsed.error.issues[0];
  return Promise.resolve(`malformed ${event.type}: ${issue?.path.join(".") || "object"} ${issue?.message ?? ""}; not applied`);
}

async function apply(event: Stripe.Event, transaction: Transaction): Promise<string> {
  switch (event.type) {
    case "checkout.session.completed":
      return withShape(sessionShape, event, (session) => sessionCompleted(session, event, transaction));
    case "checkout.session.expired":
      return withShape(sessionShape, event, (session) => sessionExpired(session, transaction));
    case "payment_intent.payment_failed":
      return withShape(intentShape, event, (intent) => paymentFailed(intent, transaction));
    case "charge.refunded":
      return withShape(chargeShape, event, (charge) => chargeRefunded(charge, transaction));
    default:
      return "not used";
  }
}

/** Applies a verified event once; says what it did ("replay" when it had been seen). */
export async function handleStripeEvent(event: Stripe.Event): Promise<string> {
  // Signed, yet without an id or a type: nothing to record it under.
  if (typeof event?.id !== "string" || !event.id || event.id.length > 255 || typeof event.type !== "string") return "malformed event; not recorded";
  return sequelize.transaction(async (transaction) => {
    // PostgreSQL's jsonb refuses a NUL character; the rest of the payload is kept as sent.
    const inserted = await sequelize.query<{ id: string }>(
      `INSERT INTO stripe_events (id, type, outcome, payload) VALUES (:id, :type, 'received', :payload) ON CONFLICT (id) DO NOTHING RETURNING id`,
      {
        replacements: { id: event.id, type: event.type.slice(0, 100), payload: JSON.stringify(event).replace(/(?<!\\)((?:\\\\)*)\\u0000/g, "$1") },
        transaction,
        type: QueryTypes.SELECT,
      },
    );
    if (inserted.length === 0) return "replay";
    const outcome = await apply(event, transaction);
    if (outcome.startsWith("no payment") || outcome.includes("not applied")) console.warn(`Stripe event ${event.id} (${event.type}): ${outcome}`);
    await StripeEvent.update({ outcome: outcome.slice(0, 200) }, { where: { id: event.id }, transaction });
    return outcome;
  });
}
