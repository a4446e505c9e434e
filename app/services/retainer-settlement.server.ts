import Stripe from "stripe";
import type { Transaction } from "sequelize";
import { Job, Organisation, type Payment, Refund, Spec, User } from "~/models/index.server";
import { formatMoney } from "~/content/money";
import { paymentSubject, recordAudit } from "./audit.server";
import { enqueueMail } from "./mail.server";
import { receiptMail, retainerReceivedMail, secondChargeToPayerMail, secondChargeToStaffMail } from "./mail-templates.server";
import { recordRetainerReceived } from "./job-progress.server";
import { isPaid, recordBalancePaid } from "./balance.server";
import { stripe } from "./stripe.server";

// The one path by which a payment becomes paid: the webhook's checkout.session.completed and the
// reconciler, which asks Stripe about sessions whose webhook never came, both end here, inside
// a transaction holding the payment row. A second charge for a retainer already paid is
// refunded at once, flagged, and both the buyer and the account manager are told.

const PAID_STATUSES = ["paid", "partially_refunded", "refunded"];

/** The fields of a completed Checkout Session this reads; Stripe's own type fits it. */
export type CompletedSession = {
  id: string;
  payment_status?: string | null;
  amount_total?: unknown;
  currency?: unknown;
  payment_intent?: string | { id: string } | null;
};

export const idOf = (value: string | { id: string } | null | undefined) => (typeof value === "string" ? value : (value?.id ?? null));

/** Why an amount and currency from Stripe differ from the payment's, or null when they match. */
export function moneyMismatch(payment: Payment, amount: unknown, currency: unknown): string | null {
  if (typeof amount !== "number" || !Number.isSafeInteger(amount)) return "no amount";
  if (amount !== payment.amountCents) return `amount ${amount} instead of ${payment.amountCents}`;
  if (typeof currency !== "string" || currency.toLowerCase() !== payment.currency.toLowerCase()) {
    return `currency ${typeof currency === "string" ? currency.slice(0, 10) : "missing"} instead of ${payment.currency.toLowerCase()}`;
  }
  return null;
}

/** Marks a payment for a person to check, keeping earlier notes (each note once: the reconciler may see the same thing again). */
export async function flagPayment(transaction: Transaction, payment: Payment, note: string) {
  if (payment.flag?.includes(note)) return;
  const flag = payment.flag ? `${payment.flag}\n${note}` : note;
  await payment.update({ flag: flag.slice(-2000), flaggedAt: new Date() }, { transaction });
}

/** Records a completed session's payment once; says what it did. `payment` is locked by the caller. */
export async function settleCompletedSession(transaction: Transaction, payment: Payment, session: CompletedSession, paidAt: Date): Promise<string> {
  if (session.payment_status !== "paid") return `session ${session.id} completed unpaid (${String(session.payment_status).slice(0, 20)})`;
  if (PAID_STATUSES.includes(payment.status)) return "payment already recorded";
  const intentId = idOf(session.payment_intent);
  const mismatch = moneyMismatch(payment, session.amount_total, session.currency) ?? (intentId ? null : "no payment intent");
  if (mismatch) {
    await flagPayment(
      transaction,
      payment,
      `A completed checkout (${session.id}) said ${mismatch}; it was not applied. Check the payment at the card service.`,
    );
    return `completed session: ${mismatch}; not applied`;
  }
  const job = await Job.findByPk(payment.jobId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  if (isPaid(job, payment.purpose)) return refundSecondCharge(transaction, payment, job, intentId!, paidAt);
  await payment.update({ status: "paid", paidAt, paymentIntentId: intentId, failureMessage: null }, { transaction });
  await recordAudit({ actor: "system", action: "payment-paid", subject: paymentSubject(payment), details: { by: "card", reference: intentId } }, transaction);
  if (payment.purpose === "balance") {
    const payer = await User.findByPk(payment.createdById, { transaction });
    await recordBalancePaid(transaction, {
      jobId: job.id,
      by: payer,
      paidById: payment.createdById,
      paidAt,
      method: "card",
      reference: intentId!,
      amountCents: payment.amountCents,
      paymentId: payment.id,
    });
    return "paid";
  }
  await recordRetainerReceived(transaction, {
    jobId: payment.jobId,
    paidById: payment.createdById,
    paidAt,
    paymentId: payment.id,
    amountCents: payment.amountCents,
    currency: payment.currency,
  });
  await sendReceipts(transaction, payment);
  return "paid";
}

/**
 * The job's retainer was already paid by another payment: this charge is refunded in full. The
 * idempotency key is the payment's, so a retried webhook (or the reconciler) asks only once.
 */
async function refundSecondCharge(transaction: Transaction, payment: Payment, job: Job, intentId: string, paidAt: Date) {
  await payment.update({ status: "paid", paidAt, paymentIntentId: intentId, failureMessage: null, duplicate: true }, { transaction });
  const refund = await Refund.create(
    {
      paymentId: payment.id,
      requestedById: null,
      amountCents: payment.amountCents,
      reason: `Automatic: the ${payment.purpose} had already been paid`,
      stripeRefundId: null,
      failureMessage: null,
      recordedAt: null,
    },
    { transaction },
  );
  let refused: string | null = null;
  try {
    const made = await stripe().refunds.create(
      { payment_intent: intentId, amount: payment.amountCents, reason: "duplicate", metadata: { payment_id: payment.id, automatic: "second_charge" } },
      { idempotencyKey: `second-charge-${payment.id}` },
    );
    await refund.update({ stripeRefundId: made.id }, { transaction });
  } catch (error) {
    if (!(error instanceof Stripe.errors.StripeError)) throw error;
    refused = error.message;
    await refund.update({ status: "failed", failureMessage: error.message }, { transaction });
  }
  const amount = formatMoney(payment.amountCents, payment.currency);
  await flagPayment(
    transaction,
    payment,
    refused
      ? `Charged a second time (${amount}) after the ${payment.purpose} was paid. The automatic refund was refused (${refused}): pay it back by hand.`
      : `Charged a second time (${amount}) after the ${payment.purpose} was paid; refunded automatically.`,
  );
  await tellOfSecondCharge(transaction, payment, job, refused);
  return refused ? "charged twice; automatic refund refused" : "charged twice; refund requested";
}

async function tellOfSecondCharge(transaction: Transaction, payment: Payment, job: Job, refused: string | null) {
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const buyer = await Organisation.findByPk(job.buyerOrganisationId, { transaction, rejectOnEmpty: true });
  const payer = await User.findByPk(payment.createdById, { transaction });
  const charge = {
    specTitle: spec.title,
    jobId: job.id,
    amountCents: payment.amountCents,
    currency: payment.currency,
    reference: payment.paymentIntentId ?? payment.id,
    refused,
    what: payment.purpose,
  };
  if (payer?.active) {
    await enqueueMail({ to: payer.email, ...secondChargeToPayerMail({ ...charge, name: payer.name }) }, transaction);
  }
  const manager = buyer.accountManagerId ? await User.findOne({ where: { id: buyer.accountManagerId, active: true }, transaction }) : null;
  // Without an account manager, the administrators hear of it.
  const staff = manager ? [manager] : await User.findAll({ where: { role: "admin", active: true }, transaction });
  for (const person of staff) {
    await enqueueMail({ to: person.email, ...secondChargeToStaffMail({ ...charge, name: person.name, buyerName: buyer.name }) }, transaction);
  }
}

/** Receipts for a paid retainer: to the buyer who paid and to the shop's people. */
async function sendReceipts(transaction: Transaction, payment: Payment) {
  const job = await Job.findByPk(payment.jobId, { transaction, rejectOnEmpty: true });
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const [buyer, shop] = await Promise.all([
    Organisation.findByPk(job.buyerOrganisationId, { transaction, rejectOnEmpty: true }),
    Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true }),
  ]);
  const payer = await User.findByPk(payment.createdById, { transaction, rejectOnEmpty: true });
  const shopPeople = await User.findAll({ where: { organisationId: shop.id, active: true }, transaction });
  const paid = {
    specTitle: spec.title,
    jobId: job.id,
    amountCents: payment.amountCents,
    currency: payment.currency,
    buyerName: buyer.name,
    paidAt: payment.paidAt ?? new Date(),
  };
  const reference = payment.paymentIntentId ?? payment.id;
  await enqueueMail({ to: payer.email, ...receiptMail({ ...paid, name: payer.name, shopName: shop.name, reference }) }, transaction);
  for (const person of shopPeople) {
    await enqueueMail({ to: person.email, ...retainerReceivedMail({ ...paid, name: person.name }) }, transaction);
  }
}
