import { randomUUID } from "node:crypto";
import nodemailer, { type Transporter } from "nodemailer";
import type PgBoss from "pg-boss";
import type { Transaction } from "sequelize";
import { env } from "~/env.server";
import { OutboxMail, sequelize } from "~/models/index.server";
import { MAIL_PRIORITIES, type MailPriority } from "~/models/outbox.server";
import { QUEUES, sendJob, workQueue } from "./work-queue.server";

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

/** pg-boss takes the highest priority first; the outbox's MAIL_PRIORITIES put the most urgent lowest. */
const jobPriority = (priority: number) => MAIL_PRIORITIES.announcement - priority;

export const MAX_ATTEMPTS = 8;
/** The earliest retry after the n-th failure: 30 s, 1 min, 2 min … (pg-boss's backoff waits up to twice this). */
export const retryDelayMs = (attempts: number) => 30_000 * 2 ** (attempts - 1);
/**
 * Longer than a sender's batch can take with nodemailer's timeouts below; a job still active then
 * (its server died mid-send) is given up and retried.
 */
const SEND_EXPIRES_SECONDS = 600;

interface MailJob {
  mailId: string;
}

/** Queues the job that delivers a mail row (the job named by its jobId), in the transaction that wrote the row. */
export async function queueDelivery(mail: OutboxMail, transaction: Transaction) {
  await sendJob(
    QUEUES.mail,
    { mailId: mail.id } satisfies MailJob,
    {
      id: mail.jobId!,
      priority: jobPriority(mail.priority),
      retryLimit: MAX_ATTEMPTS - 1,
      retryDelay: retryDelayMs(1) / 1000,
      retryBackoff: true,
      expireInSeconds: SEND_EXPIRES_SECONDS,
    },
    transaction,
  );
  // This server's sender goes at once when the change commits, instead of at its next poll.
  transaction.afterCommit(() => {
    if (senderId) workQueue().notifyWorker(senderId);
  });
}

/**
 * Queues an e-mail: its outbox row (what the admin's mail page reads) and the pg-boss job that
 * delivers it. Pass the transaction of the change the mail reports, so the mail exists exactly
 * when the change does. Requests only ever queue: nothing in a request waits for the mail server.
 */
export async function enqueueMail(message: MailMessage, transaction?: Transaction): Promise<OutboxMail> {
  if (!transaction) return sequelize.transaction((t) => enqueueMail(message, t));
  const mail = await OutboxMail.create(
    {
      to: message.to,
      subject: message.subject,
      text: message.text,
      html: message.html ?? null,
      priority: MAIL_PRIORITIES[message.priority ?? "activity"],
      lastError: null,
      sentAt: null,
      jobId: randomUUID(),
    },
    { transaction },
  );
  await queueDelivery(mail, transaction);
  return mail;
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

type Outcome = "sent" | "skipped" | { error: string; lastTry: boolean };

/**
 * One delivery attempt of a mail job. The row is locked while it is sent, so a mail is sent at
 * most once even if two jobs name it; a job that is no longer the row's (the admin sent it
 * again) or a row no longer pending delivers nothing.
 */
async function attempt(job: PgBoss.JobWithMetadata<MailJob>): Promise<Outcome> {
  return sequelize.transaction(async (transaction) => {
    const mail = await OutboxMail.findByPk(job.data.mailId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!mail || mail.status !== "pending" || mail.jobId !== job.id) return "skipped";
    const attempts = mail.attempts + 1;
    try {
      await transport().sendMail({ from: env().MAIL_FROM, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html ?? undefined });
      await mail.update({ status: "sent", attempts, sentAt: new Date(), lastError: null }, { transaction });
      return "sent";
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      const lastTry = job.retryCount >= job.retryLimit;
      await mail.update({ status: lastTry ? "failed" : "pending", attempts, lastError: message }, { transaction });
      return { error: message, lastTry };
    }
  });
}

/**
 * Delivers a batch of mail jobs, settling each on its own (a failure retries that mail alone,
 * with pg-boss's backoff; the row keeps the error and when it is tried next). Returns how many
 * were sent.
 */
async function deliverMailJobs(boss: PgBoss, jobs: PgBoss.JobWithMetadata<MailJob>[]): Promise<number> {
  let sent = 0;
  for (const job of jobs) {
    const outcome = await attempt(job);
    if (typeof outcome === "string") {
      await boss.complete(QUEUES.mail, job.id);
      if (outcome === "sent") sent++;
      continue;
    }
    await boss.fail(QUEUES.mail, job.id, { message: outcome.error });
    if (outcome.lastTry) continue;
    const retry = await boss.getJobById<MailJob>(QUEUES.mail, job.id);
    if (retry) await OutboxMail.update({ nextAttemptAt: retry.startAfter }, { where: { id: job.data.mailId, jobId: job.id, status: "pending" } });
  }
  return sent;
}

const MAIL_BATCH = 20;

/**
 * Sends the mail that is due now, in this process, most urgent first: what the sender does on
 * each poll, for tests and scripts that want the mail out before they go on.
 */
export async function deliverDueMail(limit = MAIL_BATCH): Promise<number> {
  const boss = workQueue();
  let sent = 0;
  for (let left = limit; left > 0;) {
    const jobs = await boss.fetch<MailJob>(QUEUES.mail, { batchSize: Math.min(left, MAIL_BATCH), includeMetadata: true });
    if (!jobs.length) break;
    sent += await deliverMailJobs(boss, jobs);
    left -= jobs.length;
  }
  return sent;
}

/** The mail sender of this process's work queue, woken when this process queues mail. */
let senderId: string | undefined;

/** Runs a mail sender on a started work queue: it polls every 2 s (and at once after a full batch). */
export async function startMailSender(boss: PgBoss): Promise<string> {
  const id = await boss.work<MailJob>(QUEUES.mail, { batchSize: MAIL_BATCH, includeMetadata: true, pollingIntervalSeconds: 2 }, async (jobs) => {
    await deliverMailJobs(boss, jobs);
    if (jobs.length === MAIL_BATCH) boss.notifyWorker(id);
  });
  if (boss === workQueue()) senderId = id;
  return id;
}
