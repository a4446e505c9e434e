import nodemailer, { type Transporter } from "nodemailer";
import { Op, type Transaction } from "sequelize";
import { env } from "~/env.server";
import { OutboxMail, sequelize } from "~/models/index.server";
import { MAIL_PRIORITIES, type MailPriority } from "~/models/outbox.server";

export { MAIL_PRIORITIES, type MailPriority };

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** "account" for mail someone waits for to sign in (reset, invitation, account notices);
   * "announcement" for mail to many at once; "activity" otherwise. */
  priority?: MailPriority;
}

/**
 * Queues an e-mail in the outbox. Pass the transaction of the change the mail reports, so the
 * mail exists exactly when the change does; the sender delivers it and retries failures.
 * Requests only ever queue: nothing in a request waits for the mail server.
 */
export async function enqueueMail(message: MailMessage, transaction?: Transaction) {
  return OutboxMail.create(
    {
      to: message.to,
      subject: message.subject,
      text: message.text,
      html: message.html ?? null,
      priority: MAIL_PRIORITIES[message.priority ?? "activity"],
      lastError: null,
      sentAt: null,
    },
    { transaction },
  );
}

let transporter: Transporter | undefined;
function transport() {
  const e = env();
  transporter ??= nodemailer.createTransport({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE,
    ignoreTLS: !e.SMTP_SECURE && e.SMTP_HOST === "127.0.0.1",
    auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD } : undefined,
    // A stalled mail server fails the attempt (retried later) instead of holding the sender for
    // nodemailer's defaults of minutes.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  });
  return transporter;
}

export const MAX_ATTEMPTS = 8;
/** Backoff after the n-th failure: 30 s, 1 min, 2 min … capped at an hour. */
export const retryDelayMs = (attempts: number) => Math.min(30_000 * 2 ** (attempts - 1), 3_600_000);

/**
 * Sends the mail that is due, most urgent first (priority, then the longest due). Rows are
 * claimed with SKIP LOCKED, so several app servers can run this at once without sending
 * anything twice. Returns how many were sent.
 */
export async function deliverDueMail(limit = 20): Promise<number> {
  let sent = 0;
  for (let i = 0; i < limit; i++) {
    const delivered = await sequelize.transaction(async (transaction) => {
      const mail = await OutboxMail.findOne({
        where: { status: "pending", nextAttemptAt: { [Op.lte]: new Date() } },
        order: [
          ["priority", "ASC"],
          ["nextAttemptAt", "ASC"],
        ],
        lock: transaction.LOCK.UPDATE,
        skipLocked: true,
        transaction,
      });
      if (!mail) return null;
      const attempts = mail.attempts + 1;
      try {
        await transport().sendMail({
          from: env().MAIL_FROM,
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          html: mail.html ?? undefined,
        });
        await mail.update({ status: "sent", attempts, sentAt: new Date(), lastError: null }, { transaction });
        return true;
      } catch (error) {
        const failedForGood = attempts >= MAX_ATTEMPTS;
        await mail.update(
          {
            status: failedForGood ? "failed" : "pending",
            attempts,
            lastError: error instanceof Error ? error.message : String(error),
            nextAttemptAt: new Date(Date.now() + retryDelayMs(attempts)),
          },
          { transaction },
        );
        return false;
      }
    });
    if (delivered === null) break;
    if (delivered) sent++;
  }
  return sent;
}

/** Polls the outbox in the background of an app server. */
export function startMailWorker(intervalMs = 2_000) {
  let running = false;
  const timer = setInterval(async () => {
    if (running) return;
    running = true;
    try {
      await deliverDueMail();
    } catch (error) {
      console.error("Mail delivery failed:", error);
    } finally {
      running = false;
    }
  }, intervalMs);
  timer.unref();
  return () => clearInterval(timer);
}
