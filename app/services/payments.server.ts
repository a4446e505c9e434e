import Stripe from "stripe";
import { Op, type Transaction, type WhereOptions } from "sequelize";
import { Job, Organisation, Payment, Refund, Spec, User, sequelize } from "~/models/index.server";
import { formatMoney } from "~/content/currencies";
import type { PaymentStatus } from "~/content/payment-status";
import { env } from "~/env.server";
import { FieldErrors, forbidden, notFound, requireId } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { scopedJob } from "./jobs.server";
import { stripe } from "./stripe.server";

// Retainer payments: a Checkout Session per attempt, created with an idempotency key tied to
// our payment row, so a double click or a retry after a timeout makes one session. Nothing here
// marks a payment paid: only the signed webhook does (app/services/stripe-events.server.ts).

const SERVICE_DOWN = "The card service did not answer, so nothing was charged. Try again in a minute.";

/** A session lives 24 hours at Stripe; reuse one only while it surely still takes cards. */
const REUSE_SESSION_MS = 23 * 3_600_000;

async function customerOf(organisation: Organisation, payer: User): Promise<string> {
  if (organisation.stripeCustomerId) return organisation.stripeCustomerId;
  const customer = await stripe().customers.create(
    { name: organisation.name, email: payer.email, metadata: { organisation_id: organisation.id } },
    { idempotencyKey: `customer-${organisation.id}` },
  );
  // Two first payments at once: the idempotency key gave both the same customer.
  await Organisation.update({ stripeCustomerId: customer.id }, { where: { id: organisation.id, stripeCustomerId: null } });
  return customer.id;
}

/**
 * Starts (or resumes) paying a job's retainer and gives the hosted payment page to send the
 * buyer to. Only a buyer of the job's organisation pays; a paid job is refused.
 */
export async function startRetainerPayment(user: User, jobId: string | undefined): Promise<string> {
  const job = await scopedJob(user, jobId);
  if (user.role !== "buyer") forbidden("Only the buyer pays the retainer.");
  if (job.retainerPaidAt) throw new FieldErrors({ "": ["The retainer is already paid."] });
  if (job.retainerCents <= 0) throw new FieldErrors({ "": ["This job has no retainer to pay."] });

  // One attempt at a time per job: the row lock makes two clicks share one payment row.
  const payment = await sequelize.transaction(async (transaction) => {
    await Job.findByPk(job.id, { lock: transaction.LOCK.UPDATE, transaction });
    const open = await Payment.findOne({
      where: { jobId: job.id, status: { [Op.in]: ["pending", "failed"] }, createdAt: { [Op.gt]: new Date(Date.now() - REUSE_SESSION_MS) } },
      order: [["createdAt", "DESC"]],
      transaction,
    });
    return (
      open ??
      Payment.create(
        { jobId: job.id, buyerOrganisationId: job.buyerOrganisationId, createdById: user.id, amountCents: job.retainerCents, currency: job.currency, checkoutSessionId: null, checkoutUrl: null, paymentIntentId: null, customerId: null, failureMessage: null, paidAt: null },
        { transaction },
      )
    );
  });

  try {
    if (payment.checkoutSessionId) {
      const session = await stripe().checkout.sessions.retrieve(payment.checkoutSessionId);
      if (session.status === "open" && session.url) return session.url;
      if (session.status === "complete") throw new FieldErrors({ "": ["Your card payment went through; we are waiting for the card service to confirm it."] });
      // Expired: this attempt is over, start a fresh one.
      await payment.update({ status: "expired" });
      return startRetainerPayment(user, job.id);
    }
    const [organisation, spec, shop] = await Promise.all([
      Organisation.findByPk(job.buyerOrganisationId, { rejectOnEmpty: true }),
      Spec.findByPk(job.specId, { rejectOnEmpty: true }),
      Organisation.findByPk(job.shopOrganisationId, { rejectOnEmpty: true }),
    ]);
    const customer = await customerOf(organisation, user);
    const metadata = { payment_id: payment.id, job_id: job.id };
    const base = env().APP_URL;
    const session = await stripe().checkout.sessions.create(
      {
        mode: "payment",
        customer,
        client_reference_id: job.id,
        line_items: [
          {
            quantity: 1,
            price_data: {
              currency: job.currency.toLowerCase(),
              unit_amount: job.retainerCents,
              product_data: { name: `Retainer: ${spec.title}`, description: `${Number(job.retainerPercent)} % of the awarded bid of ${shop.name}` },
            },
          },
        ],
        metadata,
        payment_intent_data: { metadata, description: `Tenderflow retainer for ${spec.title}` },
        success_url: `${base}/jobs/${job.id}/payment?session_id={CHECKOUT_SESSION_ID}`,
        cancel_url: `${base}/jobs/${job.id}?payment=cancelled`,
      },
      { idempotencyKey: `retainer-${payment.id}` },
    );
    await payment.update({ checkoutSessionId: session.id, checkoutUrl: session.url, customerId: customer });
    if (!session.url) throw new FieldErrors({ "": [SERVICE_DOWN] });
    return session.url;
  } catch (error) {
    if (error instanceof Stripe.errors.StripeError) {
      console.error("Stripe refused a retainer session:", error.message);
      throw new FieldErrors({ "": [SERVICE_DOWN] });
    }
    throw error;
  }
}

/** The payment a success page is about: the buyer's own, by its session id. */
export async function paymentOfSession(user: User, jobId: string | undefined, sessionId: string | null) {
  const job = await scopedJob(user, jobId);
  const payment = sessionId ? await Payment.findOne({ where: { jobId: job.id, checkoutSessionId: sessionId } }) : null;
  if (!payment) notFound("No such payment.");
  return { job, payment };
}

/** Payments of one job, newest first, with their refunds: for the job page. */
export async function paymentsOfJob(jobId: string) {
  return Payment.findAll({
    where: { jobId },
    include: [{ model: Refund, as: "refunds", include: [{ model: User, as: "requestedBy", attributes: ["name"] }] }],
    order: [["createdAt", "DESC"], [{ model: Refund, as: "refunds" }, "createdAt", "ASC"]],
  });
}

// ---------------------------------------------------------------------------------------------
// The payments table and refunds: account managers for their accounts, admins for all, a buyer
// for its own organisation.

async function paymentScope(viewer: User): Promise<WhereOptions<Payment>> {
  if (viewer.role === "admin") return {};
  if (viewer.role === "buyer") return { buyerOrganisationId: viewer.organisationId };
  if (viewer.role === "account_manager") {
    const accounts = await Organisation.findAll({ where: { accountManagerId: viewer.id }, attributes: ["id"] });
    return { buyerOrganisationId: accounts.map((a) => a.id) };
  }
  forbidden();
}

export const PAYMENTS_PAGE_SIZE = 50;

export async function listPayments(viewer: User, query: { status?: PaymentStatus; page?: number }) {
  const where: WhereOptions<Payment> = { [Op.and]: [await paymentScope(viewer), ...(query.status ? [{ status: query.status }] : [])] };
  const page = Math.max(1, query.page ?? 1);
  const { rows, count } = await Payment.findAndCountAll({
    where,
    include: [
      { model: Job, as: "job", attributes: ["id", "specId", "shopOrganisationId"], include: [{ model: Spec, as: "spec", attributes: ["id", "title"] }, { model: Organisation, as: "shopOrganisation", attributes: ["name"] }] },
      { model: Organisation, as: "buyerOrganisation", attributes: ["name"] },
    ],
    order: [["createdAt", "DESC"], ["id", "ASC"]],
    limit: PAYMENTS_PAGE_SIZE,
    offset: (page - 1) * PAYMENTS_PAGE_SIZE,
  });
  return { payments: rows as (Payment & { job: Job & { spec: Spec; shopOrganisation: Organisation }; buyerOrganisation: Organisation })[], total: count, page, pageCount: Math.max(1, Math.ceil(count / PAYMENTS_PAGE_SIZE)) };
}

/** What can still be paid back: paid, minus refunds recorded or on their way. */
async function refundableCents(payment: Payment, transaction: Transaction) {
  const pending = (await Refund.sum("amountCents", { where: { paymentId: payment.id, status: "requested" }, transaction })) ?? 0;
  return payment.amountCents - payment.refundedCents - Number(pending);
}

/**
 * Asks Stripe to pay back part or all of a retainer (account managers of the account, admins).
 * The refund row waits as "requested" until charge.refunded arrives by webhook.
 */
export async function requestRefund(viewer: User, paymentId: string | undefined, input: { amountCents?: number; reason: string }) {
  if (viewer.role !== "account_manager" && viewer.role !== "admin") forbidden("Only account managers and administrators pay back retainers.");
  const id = requireId(paymentId);
  const { payment, refund } = await sequelize.transaction(async (transaction) => {
    const payment = await Payment.findOne({ where: { [Op.and]: [await paymentScope(viewer), { id }] }, lock: transaction.LOCK.UPDATE, transaction });
    if (!payment) notFound("No such payment.");
    if (!["paid", "partially_refunded"].includes(payment.status) || !payment.paymentIntentId) {
      throw new FieldErrors({ amount: ["Only a paid retainer can be paid back."] });
    }
    const left = await refundableCents(payment, transaction);
    const amountCents = input.amountCents ?? left;
    if (left <= 0) throw new FieldErrors({ amount: ["Nothing is left to pay back."] });
    if (amountCents <= 0) throw new FieldErrors({ amount: ["Enter an amount above zero, or leave it empty to pay back everything left."] });
    if (amountCents > left) throw new FieldErrors({ amount: [`At most ${formatMoney(left, payment.currency)} can still be paid back.`] });
    const refund = await Refund.create({ paymentId: payment.id, requestedById: viewer.id, amountCents, reason: input.reason, stripeRefundId: null, failureMessage: null, recordedAt: null }, { transaction });
    return { payment, refund };
  });
  try {
    const made = await stripe().refunds.create(
      { payment_intent: payment.paymentIntentId!, amount: refund.amountCents, reason: "requested_by_customer", metadata: { refund_id: refund.id, payment_id: payment.id } },
      { idempotencyKey: `refund-${refund.id}` },
    );
    await refund.update({ stripeRefundId: made.id });
  } catch (error) {
    if (!(error instanceof Stripe.errors.StripeError)) throw error;
    await refund.update({ status: "failed", failureMessage: error.message });
    throw new FieldErrors({ amount: [`The card service refused the refund: ${error.message}`] });
  }
  return refund;
}

/** Receipts for a paid retainer: to the buyer who paid and to the shop's people. */
export async function sendReceipts(transaction: Transaction, payment: Payment) {
  const job = await Job.findByPk(payment.jobId, { transaction, rejectOnEmpty: true });
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const [buyer, shop] = await Promise.all([Organisation.findByPk(job.buyerOrganisationId, { transaction, rejectOnEmpty: true }), Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true })]);
  const payer = await User.findByPk(payment.createdById, { transaction, rejectOnEmpty: true });
  const shopPeople = await User.findAll({ where: { organisationId: shop.id, active: true }, transaction });
  const amount = formatMoney(payment.amountCents, payment.currency);
  const link = `${env().APP_URL}/jobs/${job.id}`;
  const when = (payment.paidAt ?? new Date()).toISOString().slice(0, 16).replace("T", " ");
  await enqueueMail(
    {
      to: payer.email,
      subject: `Receipt: retainer of ${amount} for ${spec.title}`,
      text: `Hello ${payer.name},\n\nThank you: ${buyer.name} has paid the retainer of ${amount} for "${spec.title}" to ${shop.name} by card on ${when} UTC.\nPayment reference: ${payment.paymentIntentId ?? payment.id}\n\nThe job: ${link}\n`,
    },
    transaction,
  );
  for (const person of shopPeople) {
    await enqueueMail(
      {
        to: person.email,
        subject: `Retainer received: ${amount} for ${spec.title}`,
        text: `Hello ${person.name},\n\n${buyer.name} has paid the retainer of ${amount} for "${spec.title}" on ${when} UTC. The job can go ahead: ${link}\n`,
      },
      transaction,
    );
  }
}
