import { Op, type WhereOptions } from "sequelize";
import { OutboxMail } from "~/models/index.server";
import { FieldErrors, notFound, requireId } from "./errors.server";
import { authorize, viewerOf } from "~/auth/access-policy.server";
import type { User } from "~/models/index.server";

// The admin's view of mail that did not go out: failed for good after the last attempt, or
// still waiting long after it was queued (the mail server refuses it, or no sender runs).
// "Send again" puts a mail back in the queue with a fresh set of attempts. The body is never
// shown: it can hold a sign-in link meant for its recipient only.

const MAIL_PAGE_SIZE = 25;
/** A pending mail queued longer ago than this is shown as waiting too long. */
export const WAITING_LONG_MINUTES = 15;

export const MAIL_VIEWS = ["failed", "waiting"] as const;
export type MailView = (typeof MAIL_VIEWS)[number];

function whereOf(view: MailView, now: Date): WhereOptions<OutboxMail> {
  return view === "failed" ? { status: "failed" } : { status: "pending", createdAt: { [Op.lt]: new Date(now.getTime() - WAITING_LONG_MINUTES * 60_000) } };
}

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

/** One page of failed or long-waiting mail, the most recently tried first, with both counts. */
export async function mailNeedingAttention(admin: User, view: MailView, requestedPage = 1, now = new Date()) {
  authorize(await viewerOf(admin), "platform.administer", null);
  const [failed, waiting] = await Promise.all([OutboxMail.count({ where: whereOf("failed", now) }), OutboxMail.count({ where: whereOf("waiting", now) })]);
  const total = view === "failed" ? failed : waiting;
  const pageCount = Math.max(1, Math.ceil(total / MAIL_PAGE_SIZE));
  const page = Math.min(Math.max(1, requestedPage), pageCount);
  const rows = await OutboxMail.findAll({
    where: whereOf(view, now),
    attributes: ["id", "to", "subject", "status", "attempts", "lastError", "createdAt", "updatedAt", "nextAttemptAt"],
    order: [
      ["updatedAt", "DESC"],
      ["id", "ASC"],
    ],
    limit: MAIL_PAGE_SIZE,
    offset: (page - 1) * MAIL_PAGE_SIZE,
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
  return { mails, counts: { failed, waiting }, total, page, pageCount };
}

/**
 * Queues a failed or waiting mail again, due now, with a fresh set of attempts. A mail that was
 * sent meanwhile (the sender may hold it right now: the UPDATE waits for its lock and then sees
 * "sent") is left alone and reported, so nothing goes out twice.
 */
export async function sendAgain(admin: User, mailId: string | undefined): Promise<OutboxMail> {
  authorize(await viewerOf(admin), "platform.administer", null);
  const id = requireId(mailId);
  const [count, rows] = await OutboxMail.update(
    { status: "pending", attempts: 0, nextAttemptAt: new Date() },
    { where: { id, status: { [Op.in]: ["failed", "pending"] } }, returning: true },
  );
  if (count === 0) {
    const mail = await OutboxMail.findByPk(id, { attributes: ["id", "to"] });
    if (!mail) notFound("No such mail.");
    throw new FieldErrors({ "": [`The mail to ${mail.to} was sent meanwhile; there is nothing to send again.`] });
  }
  return rows[0];
}
