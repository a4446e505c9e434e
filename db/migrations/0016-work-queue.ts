import PgBoss from "pg-boss";
import type { Migration } from "../migrator";

// Background work moves to pg-boss (a PostgreSQL job queue) in its own schema. Its tables and the
// app's queues are made here like every other table, so a request that queues a mail in its
// transaction never races a server's start (a job sent to a queue that does not exist is
// silently dropped by pg-boss). pg-boss upgrades its own schema when a later version starts.
//
// Each outbox row names the job that delivers it (outbox_mails.job_id): a job that is no longer
// the row's (the admin sent the mail again) delivers nothing. Mail pending at the migration gets
// its job here, due when it was due.
//
// reminders_sent: one row per reminder event (a deadline passing, a milestone falling overdue),
// written in the transaction that queues its mail; the primary key is what makes "once" hold
// when two servers run the same scheduled job.
const SCHEMA = "pgboss";
const QUEUES = ["mail", "bid-deadlines", "milestone-reminders", "payment-reconciliation"];

export const up: Migration = async ({ context: qi }) => {
  const [[existing]] = (await qi.sequelize.query(`SELECT to_regclass('${SCHEMA}.version') AS version`)) as [{ version: string | null }[], unknown];
  if (!existing.version) await qi.sequelize.query(PgBoss.getConstructionPlans(SCHEMA));
  for (const name of QUEUES) {
    await qi.sequelize.query(`SELECT ${SCHEMA}.create_queue(:name, '{"policy":"standard"}'::json)`, { replacements: { name } });
  }
  await qi.sequelize.query("ALTER TABLE outbox_mails ADD COLUMN job_id uuid");
  await qi.sequelize.query(`
    WITH pending AS (SELECT id, priority, next_attempt_at, gen_random_uuid() AS job_id FROM outbox_mails WHERE status = 'pending'),
    jobs AS (
      INSERT INTO ${SCHEMA}.job (id, name, data, priority, retry_limit, retry_delay, retry_backoff, start_after, expire_in, policy)
      SELECT job_id, 'mail', jsonb_build_object('mailId', id), 2 - priority, 7, 30, true, next_attempt_at, interval '5 minutes', 'standard' FROM pending
    )
    UPDATE outbox_mails o SET job_id = p.job_id FROM pending p WHERE o.id = p.id`);
  // The queue orders mail now; the old sender's index has no reader.
  await qi.sequelize.query("DROP INDEX IF EXISTS outbox_mails_due");
  await qi.sequelize.query(`
    CREATE TABLE reminders_sent (
      kind varchar(40) NOT NULL,
      subject_id uuid NOT NULL,
      occasion varchar(40) NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (kind, subject_id, occasion)
    )`);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("DROP TABLE IF EXISTS reminders_sent");
  await qi.sequelize.query("CREATE INDEX IF NOT EXISTS outbox_mails_due ON outbox_mails (priority, next_attempt_at) WHERE status = 'pending'");
  await qi.sequelize.query("ALTER TABLE outbox_mails DROP COLUMN IF EXISTS job_id");
  await qi.sequelize.query(`DROP SCHEMA IF EXISTS ${SCHEMA} CASCADE`);
};
