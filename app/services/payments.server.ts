import Stripe from "stripe";
import { Op, type Transaction, type WhereOptions } from "sequelize";
import { Job, Organisation, Payment, Refund, Spec, User, sequelize } from "~/models/index.server";
import { formatMoney } from "~/content/money";
import type { PaymentStatus } from "~/content/payment-status";
import { env } from "~/env.server";
import { recordAudit, refundSubject } from "./audit.server";
import { refundQuestionText } from "~/content/refund";
import { FieldErrors, notFound } from "./errors.server";
import { scopedJob } from "./job-reads.server";
import { pageCountOf, pageOf } from "./list-query.server";
import { authorize, can, findInScope, paymentsWhere, viewerOf } from "~/auth/access-policy.server";
import { OPEN_PAYMENT_STATUSES, type PaymentPurpose } from "~/models/payment.server";
import { balanceCentsOf, balanceRefusal, isPaid } from "./balance.server";
import { retireCheckout, syncPayment } from "./payment-sync.server";
import { isMissingAtStripe, stripe } from "./stripe.server";

// Retainer payments: a Checkout Session per attempt, created with an idempotency key tied to
// our payment row, so a double click or a retry after a timeout makes one session. A job has at
// most one open attempt (the partial unique index payments_one_open_per_job) and so at most one
// live session: a click reuses it while Stripe says it is open with time to spare, and otherwise
// expires it at Stripe before a new one is made. Only settleCompletedSession marks a payment
// paid, from the signed webhook or from what Stripe answers (payment-sync.server.ts).

const SERVICE_DOWN = "The card service did not answer, so nothing was charged. Try again in a minute.";

/** A session handed to the buyer must leave time to type a card; nearer its end, a fresh one. */
const MIN_SESSION_LEFT_MS = 15 * 60_000;

/** The organisation's Stripe customer, checked with Stripe; one it no longer knows is replaced. */
async function customerOf(organisation: Organisation, payer: User): Promise<string> {
  const stale = organisation.stripeCustomerId;
  if (stale) {
    try {
      const known = await stripe().customers.retrieve(stale);
      if (!("deleted" in known && known.deleted)) return stale;
    } catch (error) {
      if (!isMissingAtStripe(error)) throw error;
    }
  }
  const customer = await stripe().customers.create(
    { name: organisation.name, email: payer.email, metadata: { organisation_id: organisation.id } },
    { idempotencyKey: stale ? `customer-${organisation.id}-after-${stale}` : `customer-${organisation.id}` },
  );
  // Two first payments at once: the idempotency key gave both the same customer.
  await Organisation.update({ stripeCustomerId: customer.id }, { where: { id: organisation.id, stripeCustomerId: stale } });
  return customer.id;
}

/** The job's open attempt for `purpose`, or a new one; the job row lock makes two clicks share one. */
async function openPaymentOf(job: Job, user: User, purpose: PaymentPurpose): Promise<Payment> {
  return sequelize.transaction(async (transaction) => {
    const locked = await Job.findByPk(job.id, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
    if (isPaid(locked, purpose)) throw new FieldErrors({ "": [`The ${purpose} is already paid.`] });
    const open = await Payment.findOne({ where: { jobId: job.id, purpose, status: [...OPEN_PAYMENT_STATUSES] }, transaction });
    return open ?? Payment.create(newAttempt(locked, user.id, purpose), { transaction });
  });
}

/** A new payment attempt for the job's retainer (or balance), before any session exists. */
export const newAttempt = (
  job: Pick<Job, "id" | "buyerOrganisationId" | "retainerCents" | "totalCents" | "currency">,
  createdById: string,
  purpose: PaymentPurpose = "retainer",
) => ({
  jobId: job.id,
  purpose,
  buyerOrganisationId: job.buyerOrganisationId,
  createdById,
  amountCents: purpose === "balance" ? balanceCentsOf(job) : job.retainerCents,
  currency: job.currency,
  checkoutSessionId: null,
  checkoutUrl: null,
  paymentIntentId: null,
  customerId: null,
  failureMessage: null,
  paidAt: null,
});

/** Whether an open session may be handed out again: same money, and time left to pay. */
function stillUsable(session: Stripe.Checkout.Session, payment: Payment) {
  return (
    Boolean(session.url) &&
    session.amount_total === payment.amountCents &&
    session.currency === payment.currency.toLowerCase() &&
    session.expires_at * 1000 > Date.now() + MIN_SESSION_LEFT_MS
  );
}

async function newCheckout(payment: Payment, job: Job, user: User): Promise<string> {
  const [organisation, spec, shop] = await Promise.all([
    Organisation.findByPk(job.buyerOrganisationId, { rejectOnEmpty: true }),
    Spec.findByPk(job.specId, { rejectOnEmpty: true }),
    Organisation.findByPk(job.shopOrganisationId, { rejectOnEmpty: true }),
  ]);
  const customer = await customerOf(organisation, user);
  const metadata = { payment_id: payment.id, job_id: job.id };
  const base = env().APP_URL;
  const balance = payment.purpose === "balance";
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
            unit_amount: payment.amountCents,
            product_data: balance
              ? { name: `Balance: ${spec.title}`, description: `The rest of the price of the awarded bid of ${shop.name}, after the retainer` }
              : { name: `Retainer: ${spec.title}`, description: `${Number(job.retainerPercent)} % of the awarded bid of ${shop.name}` },
          },
        },
      ],
      metadata,
      payment_intent_data: { metadata, description: `Tenderflow ${payment.purpose} for ${spec.title}` },
      success_url: `${base}/jobs/${job.id}/payment?session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${base}/jobs/${job.id}?payment=cancelled`,
    },
    { idempotencyKey: `${payment.purpose}-${payment.id}` },
  );
  await payment.update({ checkoutSessionId: session.id, checkoutUrl: session.url, customerId: customer });
  if (!session.url) throw new FieldErrors({ "": [SERVICE_DOWN] });
  return session.url;
}

/**
 * Starts (or resumes) paying a job's retainer and gives the hosted payment page to send the
 * buyer to. Only a buyer of the job's organisation pays; a paid job is refused.
 */
export const startRetainerPayment = (user: User, jobId: string | undefined) => startCardPayment(user, jobId, "retainer");

/** The same for the balance, once the shop has handed over (balanceRefusal says when not). */
export const startBalancePayment = (user: User, jobId: string | undefined) => startCardPayment(user, jobId, "balance");

async function startCardPayment(user: User, jobId: string | undefined, purpose: PaymentPurpose): Promise<string> {
  const job = await scopedJob(user, jobId);
  authorize(await viewerOf(user), purpose === "balance" ? "job.payBalance" : "job.payRetainer", job);
  if (isPaid(job, purpose)) throw new FieldErrors({ "": [`The ${purpose} is already paid.`] });
  if (purpose === "retainer" && job.retainerCents <= 0) throw new FieldErrors({ "": ["This job has no retainer to pay."] });
  if (purpose === "balance") {
    const refusal = await balanceRefusal(job);
    if (refusal) throw new FieldErrors({ "": [refusal] });
  }

  try {
    // At most a stale attempt and an unknown one end before a fresh session is made.
    for (let round = 0; round < 3; round++) {
      const payment = await openPaymentOf(job, user, purpose);
      if (!payment.checkoutSessionId) return await newCheckout(payment, job, user);
      let state = await syncPayment(payment);
      if (state.kind === "open" && !stillUsable(state.session, payment)) state = await retireCheckout(payment);
      if (state.kind === "open") return state.session.url!;
      if (state.kind === "completed") {
        const paid = isPaid(await Job.findByPk(job.id, { rejectOnEmpty: true }), purpose);
        throw new FieldErrors({
          "": [
            paid
              ? `Your card payment has gone through: the ${purpose} is paid.`
              : "Your card payment went through; we are waiting for the card service to confirm it.",
          ],
        });
      }
      // Closed: the next round opens a fresh attempt.
    }
    throw new FieldErrors({ "": [SERVICE_DOWN] });
  } catch (error) {
    if (error instanceof Stripe.errors.StripeError) {
      console.error(`Stripe refused a ${purpose} session:`, error.message);
      throw new FieldErrors({ "": [SERVICE_DOWN] });
    }
    throw error;
  }
}

/** The payment a success page is about, by its session id: the buyer's own (or the account's staff's), never a shop's. */
export async function paymentOfSession(user: User, jobId: string | undefined, sessionId: string | null) {
  const job = await scopedJob(user, jobId);
  const scope = paymentsWhere(await viewerOf(user));
  const payment = sessionId ? await Payment.findOne({ where: { [Op.and]: [scope, { jobId: job.id, checkoutSessionId: sessionId }] } }) : null;
  if (!payment) notFound("No such payment.");
  // The page names the job it paid for: whoever reads the job reads its spec's title.
  const spec = await Spec.findByPk(job.specId, { attributes: ["title"] });
  return { job, payment, title: spec?.title ?? "" };
}

/**
 * The job page's retainer panel: the job's payments with their refunds, newest first, for the
 * buyer and the account's staff (a shop sees none), and what this viewer may do with them.
 */
export async function retainerPanelOf(user: User, jobId: string | undefined) {
  const viewer = await viewerOf(user);
  const job = await scopedJob(user, jobId);
  const payments = can(viewer, "job.seePayments", job)
    ? await Payment.findAll({
        where: { jobId: job.id, purpose: "retainer" },
        include: [{ model: Refund, as: "refunds", include: [{ model: User, as: "requestedBy", attributes: ["name"] }] }],
        order: [
          ["createdAt", "DESC"],
          [{ model: Refund, as: "refunds" }, "createdAt", "ASC"],
        ],
      })
    : [];
  return {
    canPay: can(viewer, "job.payRetainer", job) && job.retainerCents > 0,
    canRefund: can(viewer, "payment.refund", job),
    payments: payments.map((p) => ({
      id: p.id,
      status: p.status as PaymentStatus,
      amountCents: p.amountCents,
      refundedCents: p.refundedCents,
      currency: p.currency,
      failureMessage: p.failureMessage,
      createdAt: p.createdAt.toISOString(),
      paidAt: p.paidAt?.toISOString() ?? null,
      refunds: ((p as Payment & { refunds?: (Refund & { requestedBy?: { name: string } })[] }).refunds ?? []).map((r) => ({
        id: r.id,
        amountCents: r.amountCents,
        reason: r.reason,
        status: r.status,
        by: r.requestedBy?.name ?? "",
        at: r.createdAt.toISOString(),
        failureMessage: r.failureMessage,
      })),
    })),
  };
}

// ---------------------------------------------------------------------------------------------
// The payments table and refunds: account managers for their accounts, admins for all, a buyer
// for its own organisation.

const PAYMENTS_PAGE_SIZE = 50;

export async function listPayments(viewer: User, query: { status?: PaymentStatus; flagged?: boolean; page?: number }) {
  const where: WhereOptions<Payment> = {
    [Op.and]: [
      paymentsWhere(await viewerOf(viewer)),
      ...(query.status ? [{ status: query.status }] : []),
      ...(query.flagged ? [{ flag: { [Op.ne]: null } }] : []),
    ],
  };
  const { page, offset, limit } = pageOf(query.page, PAYMENTS_PAGE_SIZE);
  const { rows, count } = await Payment.findAndCountAll({
    where,
    include: [
      {
        model: Job,
        as: "job",
        attributes: ["id", "specId", "shopOrganisationId"],
        include: [
          { model: Spec, as: "spec", attributes: ["id", "title"] },
          { model: Organisation, as: "shopOrganisation", attributes: ["id", "name"] },
        ],
      },
      { model: Organisation, as: "buyerOrganisation", attributes: ["id", "name"] },
    ],
    order: [
      ["createdAt", "DESC"],
      ["id", "ASC"],
    ],
    limit,
    offset,
  });
  return {
    payments: rows as (Payment & { job: Job & { spec: Spec; shopOrganisation: Organisation }; buyerOrganisation: Organisation })[],
    total: count,
    page,
    pageCount: pageCountOf(count, PAYMENTS_PAGE_SIZE),
  };
}

/** What can still be paid back: paid, minus refunds recorded or on their way. */
async function refundableCents(payment: Payment, transaction?: Transaction) {
  const pending = (await Refund.sum("amountCents", { where: { paymentId: payment.id, status: "requested" }, transaction })) ?? 0;
  return payment.amountCents - payment.refundedCents - Number(pending);
}

/** The amount checked against what is left of a paid payment; throws the field error a person reads. */
async function checkRefundable(payment: Payment, amountCents: number, transaction?: Transaction) {
  if (!["paid", "partially_refunded"].includes(payment.status) || !payment.paymentIntentId) {
    throw new FieldErrors({ amount: ["Only a paid retainer or balance can be paid back."] });
  }
  const left = await refundableCents(payment, transaction);
  if (left <= 0) throw new FieldErrors({ amount: ["Nothing is left to pay back."] });
  if (amountCents <= 0) throw new FieldErrors({ amount: ["Enter an amount above zero."] });
  if (amountCents > left) throw new FieldErrors({ amount: [`At most ${formatMoney(left, payment.currency)} can still be paid back.`] });
}

/**
 * The question a refund asks before any money moves, with the amount spelled out: "Refund
 * EUR 1,250.00 of the EUR 5,000.00 retainer to Rotherby Presses?". Checks the same things the
 * refund itself does, so a refund that would be refused is refused here already.
 */
/** The job a payment is for, if the user may see the payment (a 404 otherwise). */
export async function jobIdOfPayment(user: User, paymentId: string | undefined): Promise<string> {
  const payment = await findInScope(Payment, paymentsWhere(await viewerOf(user)), paymentId, { missing: "No such payment.", attributes: ["id", "jobId"] });
  return payment.jobId;
}

export async function refundQuestion(user: User, paymentId: string | undefined, amountCents: number): Promise<string> {
  const viewer = await viewerOf(user);
  const payment = await findInScope(Payment, paymentsWhere(viewer), paymentId, {
    missing: "No such payment.",
    include: [{ model: Organisation, as: "buyerOrganisation", attributes: ["name"] }],
  });
  authorize(viewer, "payment.refund", payment);
  await checkRefundable(payment, amountCents);
  const buyer = (payment as Payment & { buyerOrganisation: Organisation }).buyerOrganisation;
  return refundQuestionText({ amountCents, paidCents: payment.amountCents, currency: payment.currency, what: payment.purpose, to: buyer.name });
}

/**
 * Asks Stripe to pay back part or all of a retainer (account managers of the account, admins).
 * The refund row waits as "requested" until charge.refunded arrives by webhook. Returns the
 * refund and the payment it is on (for the job it belongs to and its currency).
 */
export async function requestRefund(user: User, paymentId: string | undefined, input: { amountCents: number; reason: string }) {
  const viewer = await viewerOf(user);
  const { payment, refund } = await sequelize.transaction(async (transaction) => {
    const payment = await findInScope(Payment, paymentsWhere(viewer), paymentId, { missing: "No such payment.", lock: transaction.LOCK.UPDATE, transaction });
    authorize(viewer, "payment.refund", payment);
    const { amountCents } = input;
    await checkRefundable(payment, amountCents, transaction);
    const refund = await Refund.create(
      { paymentId: payment.id, requestedById: user.id, amountCents, reason: input.reason, stripeRefundId: null, failureMessage: null, recordedAt: null },
      { transaction },
    );
    await recordAudit({ actor: user, action: "refund-requested", subject: refundSubject(refund, payment), details: { reason: input.reason } }, transaction);
    return { payment, refund };
  });
  try {
    const made = await stripe().refunds.create(
      {
        payment_intent: payment.paymentIntentId!,
        amount: refund.amountCents,
        reason: "requested_by_customer",
        metadata: { refund_id: refund.id, payment_id: payment.id },
      },
      { idempotencyKey: `refund-${refund.id}` },
    );
    await refund.update({ stripeRefundId: made.id });
  } catch (error) {
    if (!(error instanceof Stripe.errors.StripeError)) throw error;
    await refund.update({ status: "failed", failureMessage: error.message });
    await recordAudit({ actor: "system", action: "refund-failed", subject: refundSubject(refund, payment), details: { answer: error.message } });
    throw new FieldErrors({ amount: [`The card service refused the refund: ${error.message}`] });
  }
  return { refund, payment };
}
