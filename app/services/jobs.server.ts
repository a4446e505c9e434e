import { Op, type Transaction, type WhereOptions } from "sequelize";
import { Bid, Job, JobEvent, JobMilestone, Organisation, Spec, User, sequelize } from "~/models/index.server";
import type { JobEventKind } from "~/models/job.server";
import {
  JOB_STAGES,
  MILESTONES,
  MILESTONE_KEYS,
  MILESTONE_LABELS,
  PAYMENT_MILESTONE,
  TARGET_SHARES,
  type JobStage,
  type MilestoneKey,
} from "~/content/job-milestones";
import { addDays, daysBetween, formatDay, isoDay, todayUtc } from "~/content/dates";
import type { JobListQuery } from "~/schemas/jobs";
import { FieldErrors } from "./errors.server";
import { authorize, can, findInScope, jobsWhere, viewerOf, type Action } from "~/auth/access-policy.server";
import { enqueueMail } from "./mail.server";
import { jobProgressMail, milestoneTakenBackMail } from "./mail-templates.server";
import { retainerCents } from "~/content/money";


// Awarded jobs: opened by the award, moved along their milestones by the shop, followed by the
// buyer's account manager. Every change is a job_events row written in the same transaction,
// and jobs.stage always names the furthest milestone reached.

// ---------------------------------------------------------------------------------------------
// Dates: pure, exported for the award and the tests (the retainer sum lives in content/money).

/**
 * Default target day of each milestone: the award day plus its share of the lead time (rounded
 * to whole days) plus its extra days. Without a lead time only the retainer gets a date.
 */
export function targetDates(awardDay: string, leadTimeWeeks: number | null): Record<MilestoneKey, string | null> {
  return Object.fromEntries(
    MILESTONE_KEYS.map((key) => {
      const { share, plusDays } = TARGET_SHARES[key];
      if (share > 0 && leadTimeWeeks == null) return [key, null];
      return [key, addDays(awardDay, Math.round((leadTimeWeeks ?? 0) * 7 * share) + plusDays)];
    }),
  ) as Record<MilestoneKey, string | null>;
}

/** A job's stage: the furthest milestone reached, or awaiting the retainer before any. */
export function stageOf(milestones: Pick<JobMilestone, "key" | "position" | "reachedAt">[]): MilestoneKey | null {
  const reached = milestones.filter((m) => m.reachedAt).sort((a, b) => b.position - a.position);
  return reached[0]?.key ?? null;
}

const overdue = (m: Pick<JobMilestone, "reachedAt" | "targetDate">, today: string) => !m.reachedAt && m.targetDate !== null && m.targetDate < today;

// ---------------------------------------------------------------------------------------------
// Opening a job (called inside the award's transaction).

export async function openJob(transaction: Transaction, args: { spec: Spec; bid: Bid; awardedBy: User }): Promise<Job> {
  const { spec, bid, awardedBy } = args;
  if (bid.specId !== spec.id) throw new Error("openJob: the bid belongs to another spec.");
  if (spec.retainerPercent === null) throw new FieldErrors({ "": ["This spec has no retainer share; it must be published before it is awarded."] });
  const awardedAt = new Date();
  const retainer = retainerCents(bid.totalCents, spec.retainerPercent);
  const job = await Job.create(
    {
      specId: spec.id,
      bidId: bid.id,
      buyerOrganisationId: spec.organisationId,
      shopOrganisationId: bid.organisationId,
      awardedById: awardedBy.id,
      awardedAt,
      currency: bid.currency,
      totalCents: bid.totalCents,
      retainerPercent: spec.retainerPercent,
      retainerCents: retainer,
      retainerPaidAt: null,
      stage: null,
    },
    { transaction },
  );
  const targets = targetDates(isoDay(awardedAt), bid.leadTimeWeeks);
  await JobMilestone.bulkCreate(
    MILESTONES.map((m, position) => ({ jobId: job.id, key: m.key, position, targetDate: targets[m.key], reachedAt: null, reachedById: null })),
    { transaction },
  );
  await JobEvent.create(
    {
      jobId: job.id,
      userId: awardedBy.id,
      kind: "awarded",
      milestone: null,
      detail: {
        bidId: bid.id,
        totalCents: bid.totalCents,
        currency: bid.currency,
        retainerPercent: spec.retainerPercent,
        retainerCents: retainer,
        leadTimeWeeks: bid.leadTimeWeeks,
      },
    },
    { transaction },
  );
  return job;
}

// ---------------------------------------------------------------------------------------------
// Reading.

export interface NextMilestone {
  key: MilestoneKey;
  label: string;
  targetDate: string | null;
}

export interface JobSummary {
  id: string;
  specId: string;
  specTitle: string;
  buyerId: string;
  buyerName: string;
  shopId: string;
  shopName: string;
  stage: JobStage;
  currency: string;
  totalCents: number;
  retainerPercent: string;
  retainerCents: number;
  retainerPaidAt: string | null;
  retainerRefundedCents: number;
  awardedAt: string;
  daysSinceAward: number;
  next: NextMilestone | null;
  overdue: boolean;
}

type JobWithParties = Job & { spec: Spec; buyerOrganisation: Organisation; shopOrganisation: Organisation };

const PARTIES = [
  { model: Spec, as: "spec", required: true },
  { model: Organisation, as: "buyerOrganisation", required: true },
  { model: Organisation, as: "shopOrganisation", required: true },
];

function summarise(job: JobWithParties, milestones: JobMilestone[], today: string): JobSummary {
  const ordered = [...milestones].sort((a, b) => a.position - b.position);
  const next = ordered.find((m) => !m.reachedAt);
  return {
    id: job.id,
    specId: job.specId,
    specTitle: job.spec.title,
    buyerId: job.buyerOrganisationId,
    buyerName: job.buyerOrganisation.name,
    shopId: job.shopOrganisationId,
    shopName: job.shopOrganisation.name,
    stage: job.stage ?? "awaiting_retainer",
    currency: job.currency,
    totalCents: job.totalCents,
    retainerPercent: job.retainerPercent,
    retainerCents: job.retainerCents,
    retainerPaidAt: job.retainerPaidAt?.toISOString() ?? null,
    retainerRefundedCents: job.retainerRefundedCents,
    awardedAt: job.awardedAt.toISOString(),
    daysSinceAward: Math.max(0, daysBetween(isoDay(job.awardedAt), today)),
    next: next ? { key: next.key, label: MILESTONE_LABELS[next.key], targetDate: next.targetDate } : null,
    overdue: ordered.some((m) => overdue(m, today)),
  };
}

// ILIKE wildcards typed by a person are matched literally.
const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** SQL: the job has an unreached milestone whose target day is before `today`. */
const overdueSql = (today: string) =>
  `EXISTS (SELECT 1 FROM job_milestones m WHERE m.job_id = "Job"."id" AND m.reached_at IS NULL AND m.target_date < ${sequelize.escape(today)})`;

function filtersOf(query: JobListQuery, today: string, withStage: boolean): WhereOptions<Job>[] {
  const where: WhereOptions<Job>[] = [];
  if (withStage && query.stage) where.push({ stage: query.stage === "awaiting_retainer" ? null : query.stage });
  // "Paid" means the money is still held: a retainer paid back in part or whole is its own choice.
  if (query.retainer === "unpaid") where.push({ retainerPaidAt: null });
  if (query.retainer === "paid") where.push({ retainerPaidAt: { [Op.ne]: null }, retainerRefundedCents: 0 });
  if (query.retainer === "refunded") where.push({ retainerRefundedCents: { [Op.gt]: 0 } });
  if (query.overdue) where.push(sequelize.literal(overdueSql(today)) as unknown as WhereOptions<Job>);
  if (query.account) where.push({ buyerOrganisationId: query.account });
  const q = query.q?.trim();
  if (q) where.push({ "$spec.title$": { [Op.iLike]: likePattern(q) } } as WhereOptions<Job>);
  return where;
}

export const JOBS_PAGE_SIZE = 25;

export interface JobList {
  jobs: JobSummary[];
  total: number;
  page: number;
  pageCount: number;
  /** Jobs per stage under the other filters (every stage listed, zeros included). */
  byStage: { stage: JobStage; count: number }[];
  /** The buyer accounts among the viewer's jobs, for the account filter (none for a buyer). */
  accounts: { id: string; name: string }[];
}

/**
 * The viewer's jobs, filtered on the server: overdue ones first, then the most recently awarded.
 * `today` is the UTC day that decides what is overdue.
 */
export async function listJobs(viewer: User, query: JobListQuery, options: { limit?: number; today?: string } = {}): Promise<JobList> {
  const today = options.today ?? todayUtc();
  const limit = options.limit ?? JOBS_PAGE_SIZE;
  const page = Math.max(1, Math.floor(query.page ?? 1) || 1);
  // Who sees which jobs is the access policy's (jobsWhere).
  const scope = jobsWhere(await viewerOf(viewer));
  const { rows, count } = await Job.findAndCountAll({
    where: { [Op.and]: [scope, ...filtersOf(query, today, true)] },
    include: PARTIES,
    order: [[sequelize.literal(overdueSql(today)), "DESC"], ["awardedAt", "DESC"], ["id", "ASC"]],
    offset: (page - 1) * limit,
    limit,
    distinct: true,
  });
  const milestones = await JobMilestone.findAll({ where: { jobId: rows.map((j) => j.id) } });
  const byJob = new Map<string, JobMilestone[]>();
  for (const m of milestones) byJob.set(m.jobId, [...(byJob.get(m.jobId) ?? []), m]);

  const stageCounts = (await Job.count({
    where: { [Op.and]: [scope, ...filtersOf(query, today, false)] },
    include: [{ model: Spec, as: "spec", attributes: [], required: true }],
    group: ["Job.stage"],
  })) as unknown as { stage: MilestoneKey | null; count: number | string }[];
  const counted = new Map(stageCounts.map((c) => [c.stage ?? "awaiting_retainer", Number(c.count)]));

  const accountIds = (await Job.count({ where: scope, group: ["buyerOrganisationId"] })) as unknown as { buyerOrganisationId: string }[];
  // The viewer's own organisation is no account to filter by: a buyer's jobs are all its own.
  const accounts = await Organisation.findAll({
    where: { id: accountIds.map((a) => a.buyerOrganisationId).filter((id) => id !== viewer.organisationId) },
    attributes: ["id", "name"],
    order: [["name", "ASC"]],
  });

  return {
    jobs: rows.map((job) => summarise(job as JobWithParties, byJob.get(job.id) ?? [], today)),
    total: count,
    page,
    pageCount: Math.max(1, Math.ceil(count / limit)),
    byStage: JOB_STAGES.map((stage) => ({ stage, count: counted.get(stage) ?? 0 })),
    accounts: accounts.map((a) => ({ id: a.id, name: a.name })),
  };
}

export interface MilestoneView {
  key: MilestoneKey;
  label: string;
  hint: string;
  position: number;
  targetDate: string | null;
  reachedAt: string | null;
  reachedBy: string | null;
  overdue: boolean;
  /** The retainer is recorded by the payment, the others by the shop. */
  recordedByPayment: boolean;
}

export interface JobEventView {
  id: string;
  kind: JobEventKind;
  milestone: MilestoneKey | null;
  body: string;
  detail: Record<string, unknown>;
  visibility: "all" | "operator";
  at: string;
  who: string;
  whoOrganisation: string;
}

export interface JobDetail extends JobSummary {
  milestones: MilestoneView[];
  events: JobEventView[];
  /** The shop milestone an undo would take back. */
  lastReached: MilestoneKey | null;
  /** Shop milestones not reached yet, in order: what "reached" may be recorded for. */
  open: MilestoneKey[];
  leadTimeWeeks: number | null;
  canRecordProgress: boolean;
  canWriteManagerNote: boolean;
}

/** A job the viewer may read (a 404 otherwise); locked for update inside a transaction. */
export async function scopedJob(viewer: User, jobId: string | undefined, transaction?: Transaction) {
  return findInScope(Job, jobsWhere(await viewerOf(viewer, transaction)), jobId, { missing: "No such job.", transaction, lock: transaction?.LOCK.UPDATE });
}

/** One job of the viewer's, with its milestones and history; operator notes only for operator roles. */
export async function jobFor(viewer: User, jobId: string | undefined, today = todayUtc()): Promise<JobDetail> {
  const access = await viewerOf(viewer);
  const job = (await findInScope(Job, jobsWhere(access), jobId, { missing: "No such job.", include: PARTIES })) as JobWithParties;
  const id = job.id;
  const milestones = await JobMilestone.findAll({ where: { jobId: id }, order: [["position", "ASC"]] });
  const events = await JobEvent.findAll({
    where: { jobId: id, ...(can(access, "job.readInternalNotes", job) ? {} : { visibility: "all" }) },
    include: [{ model: User, as: "user", include: [{ model: Organisation, as: "organisation" }] }],
    order: [["createdAt", "DESC"]],
  });
  const reachers = await User.findAll({ where: { id: milestones.flatMap((m) => (m.reachedById ? [m.reachedById] : [])) }, attributes: ["id", "name"] });
  const names = new Map(reachers.map((u) => [u.id, u.name]));
  const bid = await Bid.findByPk(job.bidId, { attributes: ["id", "leadTimeWeeks"] });
  const position = (key: MilestoneKey | null) => (key ? MILESTONE_KEYS.indexOf(key) : -1);
  const shopReached = milestones.filter((m) => m.key !== PAYMENT_MILESTONE && m.reachedAt);

  return {
    ...summarise(job, milestones, today),
    milestones: milestones.map((m) => ({
      key: m.key,
      label: MILESTONE_LABELS[m.key],
      hint: MILESTONES[m.position]?.hint ?? "",
      position: m.position,
      targetDate: m.targetDate,
      reachedAt: m.reachedAt?.toISOString() ?? null,
      reachedBy: m.reachedById ? (names.get(m.reachedById) ?? null) : null,
      overdue: overdue(m, today),
      recordedByPayment: m.key === PAYMENT_MILESTONE,
    })),
    // Several milestones reached at once share a moment: the later milestone is listed first.
    events: events
      .sort((a, b) => b.createdAt.getTime() - a.createdAt.getTime() || position(b.milestone) - position(a.milestone))
      .map((e) => {
        const user = e.get("user") as (User & { organisation?: Organisation }) | undefined;
        return {
          id: e.id,
          kind: e.kind,
          milestone: e.milestone,
          body: e.body,
          detail: e.detail,
          visibility: e.visibility,
          at: e.createdAt.toISOString(),
          who: user?.name ?? "Someone",
          whoOrganisation: user?.organisation?.name ?? "",
        };
      }),
    lastReached: shopReached.at(-1)?.key ?? null,
    open: milestones.filter((m) => m.key !== PAYMENT_MILESTONE && !m.reachedAt).map((m) => m.key),
    leadTimeWeeks: bid?.leadTimeWeeks ?? null,
    canRecordProgress: can(access, "job.recordProgress", job),
    canWriteManagerNote: can(access, "job.writeManagerNote", job),
  };
}

// ---------------------------------------------------------------------------------------------
// Changes: each locks the job, checks who may make it, writes its history row and keeps the stage.

interface Locked {
  job: Job;
  milestones: JobMilestone[];
  transaction: Transaction;
}

async function changeJob<T>(viewer: User, jobId: string | undefined, action: Action & `job.${string}`, change: (locked: Locked) => Promise<T>): Promise<T> {
  return sequelize.transaction(async (transaction) => {
    // Outside the viewer's jobs: 404; inside but not theirs to change: the policy's refusal.
    const access = await viewerOf(viewer, transaction);
    const job = await findInScope(Job, jobsWhere(access), jobId, { missing: "No such job.", transaction, lock: transaction.LOCK.UPDATE });
    authorize(access, action, job);
    const milestones = await JobMilestone.findAll({ where: { jobId: job.id }, order: [["position", "ASC"]], transaction });
    const result = await change({ job, milestones, transaction });
    const stage = stageOf(milestones);
    if (stage !== job.stage) await job.update({ stage }, { transaction });
    return result;
  });
}

async function record(
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
    const after = plan.find((x) => x.position > m.position);
    if (before && input.targetDate < before.targetDate!) {
      throw new FieldErrors({ targetDate: [`${MILESTONE_LABELS[m.key]} can't be planned before ${MILESTONE_LABELS[before.key]} (${formatDay(before.targetDate!)}). Move that one first.`] });
    }
    const from = m.targetDate;
    m.targetDate = input.targetDate;
    await m.save({ transaction });
    await record(transaction, job, viewer, "target_changed", { milestone: m.key, body: input.reason, detail: { from, to: input.targetDate } });
    // A slip carries along the milestones it would overtake, by the same number of days.
    if (after && from && input.targetDate > after.targetDate!) {
      const slip = daysBetween(from, input.targetDate);
      let floor = input.targetDate;
      for (const next of plan.filter((x) => x.position > m.position)) {
        if (next.targetDate! >= floor) break;
        const was = next.targetDate!;
        const to = addDays(was, slip) < floor ? floor : addDays(was, slip);
        next.targetDate = to;
        await next.save({ transaction });
        await record(transaction, job, viewer, "target_changed", { milestone: next.key, body: "", detail: { from: was, to, pushedBy: m.key } });
        floor = to;
      }
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

/** Queues one e-mail to every active person of the buyer and of the shop about reached milestones. */
async function tellParties(transaction: Transaction, job: Job, milestones: JobMilestone[], reached: JobMilestone[], note: string) {
  if (!reached.length) return;
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const shop = await Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true });
  const people = await User.findAll({
    where: { organisationId: [job.buyerOrganisationId, job.shopOrganisationId], active: true },
    order: [["email", "ASC"]],
    transaction,
  });
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
export async function recordRetainerReceived(transaction: Transaction, args: { jobId: string; paidById: string; paidAt: Date; paymentId: string; amountCents: number; currency: string }) {
  const job = await Job.findByPk(args.jobId, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
  if (job.retainerPaidAt) return false;
  const milestones = await JobMilestone.findAll({ where: { jobId: job.id }, order: [["position", "ASC"]], transaction });
  const milestone = milestones.find((m) => m.key === PAYMENT_MILESTONE)!;
  if (!milestone.reachedAt) await milestone.update({ reachedAt: args.paidAt, reachedById: args.paidById }, { transaction });
  await job.update({ retainerPaidAt: args.paidAt, stage: stageOf(milestones) }, { transaction });
  await JobEvent.create(
    { jobId: job.id, userId: args.paidById, kind: "retainer_paid", milestone: PAYMENT_MILESTONE, detail: { paymentId: args.paymentId, amountCents: args.amountCents, currency: args.currency } },
    { transaction },
  );
  return true;
}

/** A milestone taken back is news too: the buyer may be planning on it. */
async function tellPartiesUndone(transaction: Transaction, job: Job, milestone: JobMilestone, reason: string) {
  const spec = await Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true });
  const shop = await Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true });
  const people = await User.findAll({ where: { organisationId: [job.buyerOrganisationId, job.shopOrganisationId], active: true }, order: [["email", "ASC"]], transaction });
  for (const person of people) {
    const mail = milestoneTakenBackMail({ name: person.name, shopName: shop.name, specTitle: spec.title, jobId: job.id, milestone: MILESTONE_LABELS[milestone.key], reason });
    await enqueueMail({ to: person.email, ...mail }, transaction);
  }
}
