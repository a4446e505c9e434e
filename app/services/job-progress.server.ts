import type { JobEventKind } from "~/models/job.server";
import type { Transaction } from "sequelize";
import { Job, JobEvent, JobMilestone, Organisation, Spec, User, sequelize } from "~/models/index.server";
import { MILESTONE_LABELS, PAYMENT_MILESTONE, type MilestoneKey } from "~/content/job-milestones";
import { formatDay, isoDay } from "~/content/dates";
import { FieldErrors } from "./errors.server";
import { authorize, findInScope, jobsWhere, viewerOf, type Action } from "~/auth/access-policy.server";
import { enqueueMail } from "./mail.server";
import { jobProgressMail, milestoneTakenBackMail } from "./mail-templates.server";
import { carriedTargets, stageOf } from "./job-schedule";

// Awarded jobs: opened by the award, moved along their milestones by the shop, followed by the
// buyer's account manager. Every change is a job_events row written in the same transaction,
// and jobs.stage always names the furthest milestone reached.
// Changes: each locks the job, checks who may make it, writes its history row and keeps the stage.

interface Locked {
  job: Job;
  milestones: JobMilestone[];
  transaction: Transaction;
}

export async function changeJob<T>(
  viewer: User,
  jobId: string | undefined,
  action: Action & `job.${string}`,
  change: (locked: Locked) => Promise<T>,
): Promise<T> {
  return sequelize.transaction(async (transaction) => {
    // Outside the viewer's jobs: 404; inside but not theirs to change: the policy's refusal.
    const access = await viewerOf(viewer, transaction);
    const job = await findInScope(Job, jobsWhere(access), jobId, { missing: "No such job.", transaction, lock: transaction.LOCK.UPDATE });
    authorize(access, action, job);
    // The buyer's acceptance closes the job: its milestones and plan stay as they were.
    if (job.acceptedAt && action === "job.recordProgress") {
      throw new FieldErrors({ "": [`The buyer accepted the handover on ${formatDay(isoDay(job.acceptedAt))}; this job is closed.`] });
    }
    const milestones = await JobMilestone.findAll({ where: { jobId: job.id }, order: [["position", "ASC"]], transaction });
    const result = await change({ job, milestones, transaction });
    const stage = stageOf(milestones);
    if (stage !== job.stage) await job.update({ stage }, { transaction });
    return result;
  });
}

export async function record(
  transaction: Transaction,
  job: Job,
  user: User,
  kind: JobEventKind,
  fields: { milestone?: MilestoneKey; body?: string; detail?: Record<string, unknown>; visibility?: "all" | "operator" } = {},
) {
  return JobEvent.create(
    {
      jobId: job.id,
      userId: user.id,
      kind,
      milestone: fields.milestone ?? null,
      body: fields.body ?? "",
      detail: fields.detail ?? {},
      visibility: fields.visibility ?? "all",
    },
    { transaction },
  );
}

/**
 * Records the shop's milestones as reached up to and including `milestone`, in order: any
 * earlier shop milestone not yet reached is reached with it, each with its own history row. The
 * retainer is left to the payment and does not hold the shop back.
 */
export async function reachMilestones(viewer: User, jobId: string | undefined, input: { milestone: MilestoneKey; note: string }) {
  return changeJob(viewer, jobId, "job.recordProgress", async ({ job, milestones, transaction }) => {
    if (input.milestone === PAYMENT_MILESTONE) {
      throw new FieldErrors({ milestone: ["The retainer is recorded when the buyer's payment arrives."] });
    }
    const target = milestones.find((m) => m.key === input.milestone);
    if (!target) throw new FieldErrors({ milestone: ["Choose a milestone of this job."] });
    if (target.reachedAt) {
      throw new FieldErrors({ milestone: [`${MILESTONE_LABELS[target.key]} was already recorded on ${formatDay(isoDay(target.reachedAt))}.`] });
    }
    const shop = milestones.filter((m) => m.key !== PAYMENT_MILESTONE);
    const later = shop.find((m) => m.reachedAt && m.position > target.position);
    if (later) {
      throw new FieldErrors({ milestone: [`${MILESTONE_LABELS[later.key]} is already reached; milestones are recorded in order.`] });
    }
    const due = shop.filter((m) => !m.reachedAt && m.position <= target.position);
    const now = new Date();
    for (const m of due) {
      m.reachedAt = now;
      m.reachedById = viewer.id;
      await m.save({ transaction });
      const isTarget = m.key === target.key;
      await record(transaction, job, viewer, "milestone_reached", {
        milestone: m.key,
        body: isTarget ? input.note : "",
        detail: { targetDate: m.targetDate, ...(isTarget ? {} : { reachedWith: target.key }) },
      });
    }
    await tellParties(transaction, job, milestones, due, input.note);
    return due.map((m) => m.key);
  });
}

/** Takes back the last milestone the shop reached; `milestone` is the one the shop saw as last. */
export async function undoLastMilestone(viewer: User, jobId: string | undefined, input: { milestone: MilestoneKey; reason: string }) {
  return changeJob(viewer, jobId, "job.recordProgress", async ({ job, milestones, transaction }) => {
    const last = milestones.filter((m) => m.key !== PAYMENT_MILESTONE && m.reachedAt).at(-1);
    if (!last) throw new FieldErrors({ "": ["No milestone has been reached yet, so there is nothing to take back."] });
    if (last.key !== input.milestone) {
      throw new FieldErrors({ "": [`The last milestone reached is now ${MILESTONE_LABELS[last.key]}. Reload the page and try again.`] });
    }
    const was = { reachedAt: last.reachedAt!.toISOString(), reachedById: last.reachedById };
    last.reachedAt = null;
    last.reachedById = null;
    await last.save({ transaction });
    await record(transaction, job, viewer, "milestone_undone", { milestone: last.key, body: input.reason, detail: was });
    await tellPartiesUndone(transaction, job, last, input.reason);
    return last.key;
  });
}

/** Moves the target day of a milestone the shop has not reached yet. */
export async function changeTargetDate(viewer: User, jobId: string | undefined, input: { milestone: MilestoneKey; targetDate: string; reason: string }) {
  return changeJob(viewer, jobId, "job.recordProgress", async ({ job, milestones, transaction }) => {
    if (input.milestone === PAYMENT_MILESTONE) throw new FieldErrors({ milestone: ["The retainer's date follows the payment, not the workshop."] });
    const m = milestones.find((x) => x.key === input.milestone);
    if (!m) throw new FieldErrors({ milestone: ["Choose a milestone of this job."] });
    if (m.reachedAt) throw new FieldErrors({ milestone: [`${MILESTONE_LABELS[m.key]} is already reached; its date stays as recorded.`] });
    const awardDay = isoDay(job.awardedAt);
    if (input.targetDate < awardDay) throw new FieldErrors({ targetDate: [`Choose a day on or after the award (${formatDay(awardDay)}).`] });
    if (input.targetDate === m.targetDate) throw new FieldErrors({ targetDate: ["That is already the target date."] });
    // The plan stays in order: a target may not pass the shop milestones either side of it.
    const plan = milestones.filter((x) => x.key !== PAYMENT_MILESTONE && x.targetDate && !x.reachedAt);
    const before = plan.filter((x) => x.position < m.position).at(-1);
    if (before && input.targetDate < before.targetDate!) {
      throw new FieldErrors({
        targetDate: [
          `${MILESTONE_LABELS[m.key]} can't be planned before ${MILESTONE_LABELS[before.key]} (${formatDay(before.targetDate!)}). Move that one first.`,
        ],
      });
    }
    const from = m.targetDate;
    m.targetDate = input.targetDate;
    await m.save({ transaction });
    await record(transaction, job, viewer, "target_changed", { milestone: m.key, body: input.reason, detail: { from, to: input.targetDate } });
    // A slip carries along the milestones it would overtake, by the same number of days.
    const later = plan.filter((x) => x.position > m.position).map((x) => ({ key: x.key, targetDate: x.targetDate! }));
    for (const move of from ? carriedTargets(later, from, input.targetDate) : []) {
      const next = milestones.find((x) => x.key === move.key)!;
      next.targetDate = move.to;
      await next.save({ transaction });
      await record(transaction, job, viewer, "target_changed", { milestone: next.key, body: "", detail: { from: move.from, to: move.to, pushedBy: m.key } });
    }
    return m.key;
  });
}

/** A note from the shop about the work, seen by buyer, shop and operator alike. */
export async function addProgressNote(viewer: User, jobId: string | undefined, { body }: { body: string }) {
  return changeJob(viewer, jobId, "job.recordProgress", async ({ job, transaction }) => {
    await record(transaction, job, viewer, "progress_note", { body });
  });
}

/** An account manager's (or admin's) internal note: never shown to buyer or shop. */
export async function addManagerNote(viewer: User, jobId: string | undefined, { body }: { body: string }) {
  return changeJob(viewer, jobId, "job.writeManagerNote", async ({ job, transaction }) => {
    await record(transaction, job, viewer, "manager_note", { body, visibility: "operator" });
  });
}

/** What a mail about the job names (its spec, its shop) and who gets it: every active person of buyer and shop. */
export async function partiesOf(transaction: Transaction, job: Job) {
  // One after the other: the queries share the transaction's one connection.
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const shop = await Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true });
  const parties = [job.buyerOrganisationId, job.shopOrganisationId];
  const people = await User.findAll({ where: { organisationId: parties, active: true }, order: [["email", "ASC"]], transaction });
  return { spec, shop, people };
}

/** Queues one e-mail to every active person of the buyer and of the shop about reached milestones. */
async function tellParties(transaction: Transaction, job: Job, milestones: JobMilestone[], reached: JobMilestone[], note: string) {
  if (!reached.length) return;
  const { spec, shop, people } = await partiesOf(transaction, job);
  const next = milestones.find((m) => !m.reachedAt);
  for (const person of people) {
    const mail = jobProgressMail({
      name: person.name,
      toShop: person.organisationId === shop.id,
      shopName: shop.name,
      specTitle: spec.title,
      jobId: job.id,
      reached: reached.map((m) => MILESTONE_LABELS[m.key]),
      note,
      next: next ? { label: MILESTONE_LABELS[next.key], targetDate: next.targetDate } : null,
    });
    await enqueueMail({ to: person.email, ...mail }, transaction);
  }
}

/**
 * Records the retainer as received, inside the payment webhook's transaction: the milestone is
 * reached by the buyer who paid, the job notes when, and the history says which payment.
 * Idempotent: a job already paid keeps its first date.
 */
export async function recordRetainerReceived(
  transaction: Transaction,
  args: { jobId: string; paidById: string; paidAt: Date; paymentId: string; amountCents: number; currency: string },
) {
  const job = await Job.findByPk(args.jobId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  if (job.retainerPaidAt) return false;
  const milestones = await JobMilestone.findAll({ where: { jobId: job.id }, order: [["position", "ASC"]], transaction });
  const milestone = milestones.find((m) => m.key === PAYMENT_MILESTONE)!;
  if (!milestone.reachedAt) await milestone.update({ reachedAt: args.paidAt, reachedById: args.paidById }, { transaction });
  await job.update({ retainerPaidAt: args.paidAt, stage: stageOf(milestones) }, { transaction });
  await JobEvent.create(
    {
      jobId: job.id,
      userId: args.paidById,
      kind: "retainer_paid",
      milestone: PAYMENT_MILESTONE,
      detail: { paymentId: args.paymentId, amountCents: args.amountCents, currency: args.currency },
    },
    { transaction },
  );
  return true;
}

/** A milestone taken back is news too: the buyer may be planning on it. */
async function tellPartiesUndone(transaction: Transaction, job: Job, milestone: JobMilestone, reason: string) {
  const { spec, shop, people } = await partiesOf(transaction, job);
  for (const person of people) {
    const mail = milestoneTakenBackMail({
      name: person.name,
      shopName: shop.name,
      specTitle: spec.title,
      jobId: job.id,
      milestone: MILESTONE_LABELS[milestone.key],
      reason,
    });
    await enqueueMail({ to: person.email, ...mail }, transaction);
  }
}
