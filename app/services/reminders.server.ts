import { QueryTypes, type Transaction } from "sequelize";
import { Job, Organisation, Spec, User, sequelize } from "~/models/index.server";
import { MILESTONE_LABELS, PAYMENT_MILESTONE, type MilestoneKey } from "~/content/job-milestones";
import { addDays, daysBetween, isoDay } from "~/content/dates";
import { enqueueMail } from "./mail.server";
import { deadlinePassedMail, milestoneOverdueMail, noBidsToBuyerMail, noBidsToStaffMail } from "./mail-templates.server";

// Reminders the scheduled jobs send (run by pg-boss, see background-work.server.ts): a bid
// deadline passing (the buyer hears how many bids came, or, with none, the buyer and the account's
// manager hear so) and a job milestone falling overdue (the account's manager and the party who
// acts on it). Each event is told once: its reminders_sent row is written in the transaction
// that queues its mail, and its primary key stops a second server or a second run.
// Each function takes the clock, so tests run them at a fixed moment.

/** Events older than this when first seen (servers down, or the reminders newly switched on) are history, not news. */
const LOOKBACK_DAYS = 7;
const BATCH = 100;

type ReminderKind = "bid-deadline" | "milestone-overdue";

/** Claims an event for this run; false when it was already told (by this server or another). */
async function firstTime(kind: ReminderKind, subjectId: string, occasion: string, transaction: Transaction): Promise<boolean> {
  const rows = await sequelize.query(
    "INSERT INTO reminders_sent (kind, subject_id, occasion) VALUES (:kind, :subjectId, :occasion) ON CONFLICT DO NOTHING RETURNING kind",
    { replacements: { kind, subjectId, occasion }, type: QueryTypes.SELECT, transaction },
  );
  return rows.length === 1;
}

/** Who follows an account at the operator: its account manager, or the admins while it has none. */
async function staffOf(buyer: Organisation, transaction: Transaction): Promise<User[]> {
  const manager = buyer.accountManagerId ? await User.findOne({ where: { id: buyer.accountManagerId, active: true }, transaction }) : null;
  return manager ? [manager] : User.findAll({ where: { role: "admin", active: true }, order: [["email", "ASC"]], transaction });
}

/** The spec's author, or the buyer organisation's people if the author has left. */
async function buyersOf(spec: Spec, transaction: Transaction): Promise<User[]> {
  const author = await User.findOne({ where: { id: spec.createdById, active: true }, transaction });
  return author ? [author] : User.findAll({ where: { organisationId: spec.organisationId, active: true }, order: [["email", "ASC"]], transaction });
}

interface PassedDeadline {
  id: string;
  occasion: string;
  bids: number;
}

/** Tells of every open spec whose bid deadline passed (once per spec and deadline: a revision may set a new one). Returns how many were told. */
export async function remindOfPassedDeadlines(now = new Date()): Promise<number> {
  const passed = await sequelize.query<PassedDeadline>(
    `SELECT s.id, o.occasion, (SELECT count(*) FROM bids b WHERE b.spec_id = s.id AND b.status = 'submitted')::int AS bids
     FROM specs s CROSS JOIN LATERAL (SELECT to_char(s.bid_deadline AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"') AS occasion) o
     WHERE s.status = 'open' AND s.bid_deadline <= :now AND s.bid_deadline > :since
       AND NOT EXISTS (SELECT 1 FROM reminders_sent r WHERE r.kind = 'bid-deadline' AND r.subject_id = s.id AND r.occasion = o.occasion)
     ORDER BY s.bid_deadline LIMIT :limit`,
    { replacements: { now, since: new Date(now.getTime() - LOOKBACK_DAYS * 86_400_000), limit: BATCH }, type: QueryTypes.SELECT },
  );
  let told = 0;
  for (const event of passed) {
    const sent = await sequelize.transaction(async (transaction) => {
      if (!(await firstTime("bid-deadline", event.id, event.occasion, transaction))) return false;
      const spec = await Spec.findByPk(event.id, { transaction, rejectOnEmpty: true });
      const facts = { specId: spec.id, specTitle: spec.title, deadline: spec.bidDeadline! };
      for (const buyer of await buyersOf(spec, transaction)) {
        const mail = event.bids > 0 ? deadlinePassedMail({ ...facts, name: buyer.name, bids: event.bids }) : noBidsToBuyerMail({ ...facts, name: buyer.name });
        await enqueueMail({ to: buyer.email, ...mail }, transaction);
      }
      if (event.bids === 0) {
        const organisation = await Organisation.findByPk(spec.organisationId, { transaction, rejectOnEmpty: true });
        for (const person of await staffOf(organisation, transaction)) {
          await enqueueMail({ to: person.email, ...noBidsToStaffMail({ ...facts, name: person.name, buyerName: organisation.name }) }, transaction);
        }
      }
      return true;
    });
    if (sent) told++;
  }
  return told;
}

interface OverdueMilestone {
  id: string;
  jobId: string;
  key: MilestoneKey;
  targetDate: string;
}

/**
 * Tells of every milestone of an open job past its target day and not reached: the account's
 * manager and the party who acts on it (the shop; the buyer for the retainer, which the payment
 * records). Once per milestone and target day: a target moved later that passes again is told
 * again. Returns how many were told.
 */
export async function remindOfOverdueMilestones(now = new Date()): Promise<number> {
  const today = isoDay(now);
  const overdue = await sequelize.query<OverdueMilestone>(
    `SELECT m.id, m.job_id AS "jobId", m.key, m.target_date::text AS "targetDate"
     FROM job_milestones m JOIN jobs j ON j.id = m.job_id
     WHERE m.reached_at IS NULL AND j.accepted_at IS NULL AND m.target_date < :today AND m.target_date >= :since
       AND NOT EXISTS (SELECT 1 FROM reminders_sent r WHERE r.kind = 'milestone-overdue' AND r.subject_id = m.id AND r.occasion = m.target_date::text)
     ORDER BY m.target_date, m.job_id, m.position LIMIT :limit`,
    { replacements: { today, since: addDays(today, -LOOKBACK_DAYS), limit: BATCH }, type: QueryTypes.SELECT },
  );
  let told = 0;
  for (const event of overdue) {
    const sent = await sequelize.transaction(async (transaction) => {
      if (!(await firstTime("milestone-overdue", event.id, event.targetDate, transaction))) return false;
      const job = await Job.findByPk(event.jobId, { transaction, rejectOnEmpty: true });
      const [spec, buyer, shop] = await Promise.all([
        Spec.findByPk(job.specId, { transaction, rejectOnEmpty: true }),
        Organisation.findByPk(job.buyerOrganisationId, { transaction, rejectOnEmpty: true }),
        Organisation.findByPk(job.shopOrganisationId, { transaction, rejectOnEmpty: true }),
      ]);
      const actor = event.key === PAYMENT_MILESTONE ? "buyer" : "shop";
      const actors = await User.findAll({
        where: { organisationId: actor === "buyer" ? buyer.id : shop.id, active: true },
        order: [["email", "ASC"]],
        transaction,
      });
      const facts = {
        buyerName: buyer.name,
        shopName: shop.name,
        specTitle: spec.title,
        jobId: job.id,
        milestone: MILESTONE_LABELS[event.key],
        targetDate: event.targetDate,
        daysLate: daysBetween(event.targetDate, today),
      };
      for (const person of actors) await enqueueMail({ to: person.email, ...milestoneOverdueMail({ ...facts, name: person.name, role: actor }) }, transaction);
      for (const person of await staffOf(buyer, transaction)) {
        await enqueueMail({ to: person.email, ...milestoneOverdueMail({ ...facts, name: person.name, role: "staff" }) }, transaction);
      }
      return true;
    });
    if (sent) told++;
  }
  return told;
}
