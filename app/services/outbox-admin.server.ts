import { randomUUID } from "node:crypto";
import { Op, QueryTypes, type Order, type WhereOptions } from "sequelize";
import { OutboxMail, sequelize } from "~/models/index.server";
import type { SortOf } from "~/schemas/list-sort";
import { FieldErrors, notFound, requireId } from "./errors.server";
import { pageCountOf, pageOf } from "./list-query.server";
import { queueDelivery } from "./mail.server";
import { SCHEDULES } from "./background-work.server";
import { QUEUE_SCHEMA } from "./work-queue.server";
import { authorize, viewerOf } from "~/auth/access-policy.server";
import type { User } from "~/models/index.server";

// The admin's view of mail that did not go out: failed for good after the last attempt, still
// waiting long after it was queued (the mail server refuses it, or no sender runs), or everything
// queued now with when it is tried next.
// "Send again" puts a mail back in the queue with a fresh set of attempts. The body is never
// shown: it can hold a sign-in link meant for its recipient only.

const MAIL_PAGE_SIZE = 25;
/** A pending mail queued longer ago than this is shown as waiting too long. */
export const WAITING_LONG_MINUTES = 15;

export const MAIL_VIEWS = ["failed", "waiting", "queued"] as const;
export type MailView = (typeof MAIL_VIEWS)[number];

function whereOf(view: MailView, now: Date): WhereOptions<OutboxMail> {
  if (view === "failed") return { status: "failed" };
  if (view === "queued") return { status: "pending" };
  return { status: "pending", createdAt: { [Op.lt]: new Date(now.getTime() - WAITING_LONG_MINUTES * 60_000) } };
}

// Each order ends on the id, so a page boundary never shows a mail twice or skips one.
const MAIL_ORDERS: Record<SortOf<"mail">, Order> = {
  "last-tried": [
    ["updatedAt", "DESC"],
    ["id", "ASC"],
  ],
  "longest-waiting": [
    ["createdAt", "ASC"],
    ["id", "ASC"],
  ],
  recipient: [
    ["to", "ASC"],
    ["createdAt", "ASC"],
    ["id", "ASC"],
  ],
};

export interface StuckMail {
  id: string;
  to: string;
  subject: string;
  status: "pending" | "failed";
  attempts: number;
  lastError: string | null;
  queuedAt: string;
  lastTriedAt: string | null;
  nextAttemptAt: string | null;
}

/** One page of failed, long-waiting or queued mail in the order asked (the most recently tried first by default), with each view's count. */
export async function mailNeedingAttention(
  admin: User,
  view: MailView,
  { page: requestedPage, sort = "last-tried" }: { page?: number; sort?: SortOf<"mail"> } = {},
  now = new Date(),
) {
  authorize(await viewerOf(admin), "platform.administer", null);
  const [failed, waiting, queued] = await Promise.all(MAIL_VIEWS.map((v) => OutboxMail.count({ where: whereOf(v, now) })));
  const counts: Record<MailView, number> = { failed, waiting, queued };
  const total = counts[view];
  const pageCount = pageCountOf(total, MAIL_PAGE_SIZE);
  const { page, offset, limit } = pageOf(Math.min(requestedPage ?? 1, pageCount), MAIL_PAGE_SIZE);
  const rows = await OutboxMail.findAll({
    where: whereOf(view, now),
    attributes: ["id", "to", "subject", "status", "attempts", "lastError", "createdAt", "updatedAt", "nextAttemptAt"],
    order: MAIL_ORDERS[sort],
    limit,
    offset,
  });
  const mails: StuckMail[] = rows.map((m) => ({
    id: m.id,
    to: m.to,
    subject: m.subject,
    status: m.status as "pending" | "failed",
    attempts: m.attempts,
    lastError: m.lastError,
    queuedAt: m.createdAt.toISOString(),
    lastTriedAt: m.attempts > 0 ? m.updatedAt.toISOString() : null,
    nextAttemptAt: m.status === "pending" ? m.nextAttemptAt.toISOString() : null,
  }));
  return { mails, counts, total, page, pageCount };
}

export interface ScheduledWork {
  label: string;
  every: string;
  lastDoneAt: string | null;
  lastFailedAt: string | null;
  lastError: string | null;
}

/**
 * What the background work is doing: mail queued now, and each schedule's last finished and last
 * failed run (the queue keeps finished jobs for 12 hours before archiving them).
 */
export async function backgroundWorkOverview(admin: User): Promise<{ queued: number; schedules: ScheduledWork[] }> {
  authorize(await viewerOf(admin), "platform.administer", null);
  const queued = await OutboxMail.count({ where: { status: "pending" } });
  const runs = await sequelize.query<{ name: string; lastDoneAt: Date | null; lastFailedAt: Date | null; lastError: string | null }>(
    `SELECT name,
       max(completed_on) FILTER (WHERE state = 'completed') AS "lastDoneAt",
       max(completed_on) FILTER (WHERE state = 'failed') AS "lastFailedAt",
       (array_agg(output->>'message' ORDER BY completed_on DESC) FILTER (WHERE state = 'failed'))[1] AS "lastError"
     FROM ${QUEUE_SCHEMA}.job WHERE name IN (:names) GROUP BY name`,
    { replacements: { names: SCHEDULES.map((s) => s.queue) }, type: QueryTypes.SELECT },
  );
  const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
  const schedules = SCHEDULES.map(({ queue, label, every }) => {
    const run = runs.find((r) => r.name === queue);
    return { label, every, lastDoneAt: iso(run?.lastDoneAt ?? null), lastFailedAt: iso(run?.lastFailedAt ?? null), lastError: run?.lastError ?? null };
  });
  return { queued, schedules };
}

/**
 * Queues a failed or waiting mail again, due now, with a fresh set of attempts and a new job
 * (the old one, if still retrying, is no longer the row's and sends nothing). A mail that was
 * sent meanwhile (the sender may hold it right now: the UPDATE waits for its lock and then sees
 * "sent") is left alone and reported, so nothing goes out twice.
 */
export async function sendAgain(admin: User, mailId: string | undefined): Promise<OutboxMail> {
  authorize(await viewerOf(admin), "platform.administer", null);
  const id = requireId(mailId);
  return sequelize.transaction(async (transaction) => {
    const [count, rows] = await OutboxMail.update(
      { status: "pending", attempts: 0, nextAttemptAt: new Date(), jobId: randomUUID() },
      { where: { id, status: { [Op.in]: ["failed", "pending"] } }, returning: true, transaction },
    );
    if (count === 0) {
      const mail = await OutboxMail.findByPk(id, { attributes: ["id", "to"], transaction });
      if (!mail) notFound("No such mail.");
      throw new FieldErrors({ "": [`The mail to ${mail.to} was sent meanwhile; there is nothing to send again.`] });
    }
    await queueDelivery(rows[0], transaction);
    return rows[0];
  });
}
