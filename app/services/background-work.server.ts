import { startMailSender } from "./mail.server";
import { reconcileOpenPayments } from "./payment-sync.server";
import { remindOfOverdueMilestones, remindOfPassedDeadlines } from "./reminders.server";
import { QUEUES, workQueue, type QueueName } from "./work-queue.server";

// What every app server runs in the background, on pg-boss (work-queue.server.ts): the mail
// sender and the scheduled jobs. Each app process (each node:cluster worker) starts it: pg-boss
// claims each job with SKIP LOCKED and turns each schedule into one job per minute across all
// processes, so adding servers adds senders, never a second copy of a job. Starting it in the
// cluster's primary instead would put app code in the process whose only task is to keep the
// workers alive, and would differ from a single-process server.

interface Scheduled {
  queue: QueueName;
  /** What it does and how often, in words, for the admin's mail page. */
  label: string;
  every: string;
  /** When, as cron in UTC (pg-boss's schedules are to the minute). */
  cron: string;
  run: (now: Date) => Promise<unknown>;
}

export const SCHEDULES: Scheduled[] = [
  // Deadlines end at a moment (23:59:59 UTC of the day chosen): told within a minute.
  { queue: QUEUES.bidDeadlines, label: "Bid deadlines passing", every: "every minute", cron: "* * * * *", run: remindOfPassedDeadlines },
  // Targets are whole days: a quarter of an hour after midnight UTC is soon enough.
  { queue: QUEUES.milestoneReminders, label: "Overdue milestones", every: "every 15 minutes", cron: "*/15 * * * *", run: remindOfOverdueMilestones },
  // A payment without its webhook is asked about after five minutes; each minute picks up the due ones.
  {
    queue: QUEUES.paymentReconciliation,
    label: "Payments without their webhook",
    every: "every minute",
    cron: "* * * * *",
    run: () => reconcileOpenPayments(),
  },
];

/** How long a stop waits for running jobs before handing them back for a retry elsewhere (within serve's own 3 s). */
const STOP_TIMEOUT_MS = 2_500;

/**
 * Starts the background work, trying again every 30 s while it cannot (the database unreachable
 * as the server boots), so a server that came up early still sends mail once the database is back.
 */
export async function keepStartingBackgroundWork(retryMs = 30_000): Promise<() => Promise<void>> {
  for (;;) {
    try {
      return await startBackgroundWork();
    } catch (error) {
      console.error(`Background work did not start; trying again in ${retryMs / 1000} s:`, error);
      await new Promise((resolve) => setTimeout(resolve, retryMs).unref());
    }
  }
}

/** Starts the work queue, the mail sender and the schedules; resolves to a function that stops them cleanly. */
export async function startBackgroundWork(): Promise<() => Promise<void>> {
  const boss = workQueue();
  await boss.start();
  // Migration 0016 made them; a queue added since is made here (a no-op for existing ones).
  for (const name of Object.values(QUEUES)) await boss.createQueue(name);
  await startMailSender(boss);
  for (const { queue, cron, run } of SCHEDULES) {
    // A run that fails is not retried: the next minute's run does the same work.
    await boss.schedule(queue, cron, {}, { retryLimit: 0, expireInSeconds: 600 });
    // Polled every 5 s, not the mail's 2 s: the work comes at most once a minute.
    await boss.work(queue, { pollingIntervalSeconds: 5 }, async () => {
      await run(new Date());
    });
  }
  return () => boss.stop({ graceful: true, timeout: STOP_TIMEOUT_MS });
}
