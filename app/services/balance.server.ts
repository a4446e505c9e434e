import type { Transaction } from "sequelize";
import { Job, JobEvent, JobMilestone, Organisation, Payment, User, sequelize } from "~/models/index.server";
import type { BalanceMethod } from "~/models/job.server";
import type { PaymentPurpose } from "~/models/payment.server";
import type { PaymentStatus } from "~/content/payment-status";
import { can, viewerOf } from "~/auth/access-policy.server";
import { formatDay, isoDay } from "~/content/dates";
import { formatMoney } from "~/content/money";
import { recordAudit } from "./audit.server";
import { FieldErrors } from "./errors.server";
import { enqueueMail } from "./mail.server";
import { balanceReceiptMail, balanceReceivedMail } from "./mail-templates.server";
import { jobForAction } from "./job-files.server";
import { partiesOf } from "./job-progress.server";
import { scopedJob } from "./job-reads.server";

// The balance: the rest of the price (total − retainer), due once the shop has handed over. The
// buyer pays it by card exactly as the retainer (payments.server.ts with purpose "balance": one
// open checkout, the webhook, the reconciler, a second charge refunded by itself), or the
// account's manager records a bank transfer. Either way it is recorded once, with receipts.

/** What is left to pay after the retainer. */
export const balanceCentsOf = (job: Pick<Job, "totalCents" | "retainerCents">) => job.totalCents - job.retainerCents;

export const isPaid = (job: Pick<Job, "retainerPaidAt" | "balancePaidAt">, purpose: PaymentPurpose) =>
  Boolean(purpose === "balance" ? job.balancePaidAt : job.retainerPaidAt);

/**
 * Why the balance can't be paid now, or null. It falls due at the handover (the rule:
 * "after handover"): the buyer may pay on delivery or after accepting; while a reported problem
 * has taken the handover back it waits, and the retainer comes first.
 */
export async function balanceRefusal(job: Job, transaction?: Transaction): Promise<string | null> {
  if (job.balancePaidAt) return `The balance was paid on ${formatDay(isoDay(job.balancePaidAt))}.`;
  if (balanceCentsOf(job) <= 0) return "This job has no balance to pay.";
  if (!job.retainerPaidAt) return "The retainer is paid first; the balance follows the handover.";
  const handover = await JobMilestone.findOne({ where: { jobId: job.id, key: "handed_over" }, transaction });
  if (!job.acceptedAt && !handover?.reachedAt) return "The balance falls due when the shop has handed over the unit.";
  return null;
}

/**
 * Records the balance as paid, inside the transaction that proves it (the card's settlement or
 * the manager's entry): the job, its history, the audit log and the receipts. Idempotent.
 */
export async function recordBalancePaid(
  transaction: Transaction,
  args: { jobId: string; by: User | null; paidById: string; paidAt: Date; method: BalanceMethod; reference: string; amountCents: number; paymentId?: string },
): Promise<boolean> {
  const job = await Job.findByPk(args.jobId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  if (job.balancePaidAt) return false;
  await job.update({ balancePaidAt: args.paidAt, balanceMethod: args.method, balanceReference: args.reference.slice(0, 200) }, { transaction });
  await JobEvent.create(
    {
      jobId: job.id,
      userId: args.paidById,
      kind: "balance_paid",
      milestone: null,
      detail: { method: args.method, reference: args.reference, amountCents: args.amountCents, currency: job.currency, paymentId: args.paymentId ?? null },
    },
    { transaction },
  );
  if (args.method === "bank_transfer") {
    await recordAudit(
      {
        actor: args.by ?? "system",
        action: "payment-recorded",
        subject: { type: "job", id: job.id, label: `Balance of ${formatMoney(args.amountCents, job.currency)} for job ${job.id.slice(0, 8)}` },
        details: { by: "bank transfer", reference: args.reference },
      },
      transaction,
    );
  }
  await sendBalanceReceipts(transaction, job, args);
  return true;
}

/** Receipts: to the buyer's people (what they paid) and the shop's (what they received). */
async function sendBalanceReceipts(transaction: Transaction, job: Job, args: { paidAt: Date; method: BalanceMethod; reference: string; amountCents: number }) {
  const { spec, shop, people } = await partiesOf(transaction, job);
  const buyer = await Organisation.findByPk(job.buyerOrganisationId, { transaction, rejectOnEmpty: true });
  const paid = {
    specTitle: spec.title,
    jobId: job.id,
    amountCents: args.amountCents,
    currency: job.currency,
    buyerName: buyer.name,
    shopName: shop.name,
    paidAt: args.paidAt,
    method: args.method,
    reference: args.reference,
  };
  for (const person of people) {
    const mail = person.organisationId === shop.id ? balanceReceivedMail({ ...paid, name: person.name }) : balanceReceiptMail({ ...paid, name: person.name });
    await enqueueMail({ to: person.email, ...mail }, transaction);
  }
}

/** The account's manager (or an admin) records the balance as paid by bank transfer. */
export async function recordBankTransfer(user: User, jobId: string | undefined, input: { reference: string; paidOn: string }) {
  return sequelize.transaction(async (transaction) => {
    const job = await jobForAction(user, jobId, "job.recordBankTransfer", transaction);
    const refusal = await balanceRefusal(job, transaction);
    if (refusal) throw new FieldErrors({ "": [refusal] });
    if (input.paidOn > isoDay(new Date())) throw new FieldErrors({ paidOn: ["A transfer can't arrive in the future."] });
    if (input.paidOn < isoDay(job.awardedAt)) throw new FieldErrors({ paidOn: [`Choose a day on or after the award (${formatDay(isoDay(job.awardedAt))}).`] });
    await recordBalancePaid(transaction, {
      jobId: job.id,
      by: user,
      paidById: user.id,
      paidAt: new Date(`${input.paidOn}T12:00:00Z`),
      method: "bank_transfer",
      reference: input.reference,
      amountCents: balanceCentsOf(job),
    });
  });
}

export interface BalancePanel {
  amountCents: number;
  currency: string;
  paidAt: string | null;
  method: BalanceMethod | null;
  reference: string | null;
  /** Why it can't be paid now (null when it can, or when paid). */
  waiting: string | null;
  canPay: boolean;
  canRecordTransfer: boolean;
  payments: { id: string; status: PaymentStatus; amountCents: number; createdAt: string; paidAt: string | null; failureMessage: string | null }[];
}

/** The job page's balance: its state, its card attempts (buyer and staff), and what the viewer may do. */
export async function balancePanelOf(user: User, jobId: string | undefined): Promise<BalancePanel> {
  const job = await scopedJob(user, jobId);
  const viewer = await viewerOf(user);
  const waiting = job.balancePaidAt ? null : await balanceRefusal(job);
  const payments = can(viewer, "job.seePayments", job)
    ? await Payment.findAll({ where: { jobId: job.id, purpose: "balance" }, order: [["createdAt", "DESC"]] })
    : [];
  return {
    amountCents: balanceCentsOf(job),
    currency: job.currency,
    paidAt: job.balancePaidAt?.toISOString() ?? null,
    method: job.balanceMethod ?? null,
    // The transfer's reference is the buyer's and Tenderflow's business, like the payments.
    reference: can(viewer, "job.seePayments", job) ? (job.balanceReference ?? null) : null,
    waiting,
    canPay: !job.balancePaidAt && !waiting && can(viewer, "job.payBalance", job),
    canRecordTransfer: !job.balancePaidAt && !waiting && can(viewer, "job.recordBankTransfer", job),
    payments: payments.map((p) => ({
      id: p.id,
      status: p.status,
      amountCents: p.amountCents,
      createdAt: p.createdAt.toISOString(),
      paidAt: p.paidAt?.toISOString() ?? null,
      failureMessage: p.failureMessage,
    })),
  };
}
