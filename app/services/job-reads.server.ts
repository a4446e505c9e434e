import type { JobEventKind } from "~/models/job.server";
import type { JobListQuery } from "~/schemas/jobs";
import { Op, type Transaction, type WhereOptions } from "sequelize";
import { Bid, Job, JobEvent, JobMilestone, Organisation, Spec, User, sequelize } from "~/models/index.server";
import { JOB_STAGES, MILESTONES, MILESTONE_KEYS, MILESTONE_LABELS, PAYMENT_MILESTONE, type JobStage, type MilestoneKey } from "~/content/job-milestones";
import { daysBetween, isoDay, todayUtc } from "~/content/dates";
import { can, findInScope, jobsWhere, viewerOf } from "~/auth/access-policy.server";
import { readOncePerRequest } from "~/http/request-scope.server";
import { isOverdue } from "./job-schedule";
import { likePattern, pageCountOf, pageOf } from "./list-query.server";

// Reading jobs: the list (filtered, sorted and paged in PostgreSQL) and one job's page, each
// through the access policy's jobsWhere, with what the viewer may do.

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
  /** The buyer accepted the handover: the job is closed. */
  acceptedAt: string | null;
  balancePaidAt: string | null;
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
    acceptedAt: job.acceptedAt?.toISOString() ?? null,
    balancePaidAt: job.balancePaidAt?.toISOString() ?? null,
    awardedAt: job.awardedAt.toISOString(),
    daysSinceAward: Math.max(0, daysBetween(isoDay(job.awardedAt), today)),
    next: next ? { key: next.key, label: MILESTONE_LABELS[next.key], targetDate: next.targetDate } : null,
    overdue: ordered.some((m) => isOverdue(m, today)),
  };
}

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
  if (query.shop) where.push({ shopOrganisationId: query.shop });
  const q = query.q?.trim();
  if (q) where.push({ "$spec.title$": { [Op.iLike]: likePattern(q) } } as WhereOptions<Job>);
  return where;
}

const JOBS_PAGE_SIZE = 25;

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
  const { page, offset, limit } = pageOf(query.page, options.limit ?? JOBS_PAGE_SIZE);
  // Who sees which jobs is the access policy's (jobsWhere).
  const scope = jobsWhere(await viewerOf(viewer));
  const { rows, count } = await Job.findAndCountAll({
    where: { [Op.and]: [scope, ...filtersOf(query, today, true)] },
    include: PARTIES,
    order: [
      [sequelize.literal(overdueSql(today)), "DESC"],
      ["awardedAt", "DESC"],
      ["id", "ASC"],
    ],
    offset,
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
    pageCount: pageCountOf(count, limit),
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
  const load = async () =>
    findInScope(Job, jobsWhere(await viewerOf(viewer, transaction)), jobId, { missing: "No such job.", transaction, lock: transaction?.LOCK.UPDATE });
  // A job page's panels each check the same job: read once per page view (never inside a transaction).
  return transaction ? load() : readOncePerRequest(`job ${jobId} for ${viewer.id}`, load);
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
      overdue: isOverdue(m, today),
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
