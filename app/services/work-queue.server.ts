import PgBoss from "pg-boss";
import type pg from "pg";
import type { Transaction } from "sequelize";
import { sequelize } from "~/db.server";

// The one mechanism for background work: pg-boss, a job queue in the app's own PostgreSQL
// (schema `pgboss`, made by migration 0016). A job is claimed with SKIP LOCKED by one server
// only, so any number of app servers run the same workers and each job runs once; schedules
// (cron) are turned into one job per minute across all servers the same way.
//
// pg-boss runs its SQL on the app's own connections rather than a second pool, and a job can be
// sent inside a change's Sequelize transaction: it exists exactly when the change commits.

export const QUEUE_SCHEMA = "pgboss";

/** Every queue the app uses (made by migration 0016; a new one also at start). */
export const QUEUES = {
  mail: "mail",
  bidDeadlines: "bid-deadlines",
  milestoneReminders: "milestone-reminders",
  paymentReconciliation: "payment-reconciliation",
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

type Client = pg.ClientBase;

/** A pooled connection per statement, handed back afterwards (or dropped if the statement failed, as pg's own pool does). */
const appConnections: PgBoss.Db = {
  async executeSql(text, values) {
    const client = (await sequelize.connectionManager.getConnection({ type: "write" })) as Client;
    try {
      const result = await client.query(text, values);
      sequelize.connectionManager.releaseConnection(client);
      return result;
    } catch (error) {
      // A failed statement may leave a transaction open on the connection: never reuse it.
      await sequelize.connectionManager.destroyConnection(client);
      throw error;
    }
  },
};

/** Runs pg-boss's statements on the connection of a Sequelize transaction. */
export function inTransaction(transaction: Transaction): PgBoss.Db {
  const client = (transaction as unknown as { connection: Client }).connection;
  return { executeSql: (text, values) => client.query(text, values) };
}

/** A pg-boss on the app's database; `options` for a test's own second instance. */
export function createWorkQueue(options: Omit<PgBoss.ConstructorOptions, "db" | "schema"> = {}) {
  const boss = new PgBoss({ ...options, db: appConnections, schema: QUEUE_SCHEMA });
  // Errors in its background loops (a lost connection) are logged; the loops carry on.
  boss.on("error", (error) => console.error("Background work:", error));
  return boss;
}

let boss: PgBoss | undefined;

/** The process's pg-boss (not started: sending and fetching need no start; workers do). */
export function workQueue(): PgBoss {
  boss ??= createWorkQueue();
  return boss;
}

/**
 * Queues a job in the transaction of the change it belongs to. Throws if the queue is missing,
 * since pg-boss would otherwise drop the job without a word.
 */
export async function sendJob(queue: QueueName, data: object, options: PgBoss.SendOptions, transaction: Transaction): Promise<string> {
  const id = await workQueue().send(queue, data, { ...options, db: inTransaction(transaction) });
  if (!id) throw new Error(`The job queue "${queue}" does not exist: run the migrations.`);
  return id;
}
