import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// One live checkout per job, payments a person must look at, the reconciler's lease, and
// refunds Tenderflow makes by itself (a second charge for a retainer already paid).
export const up: Migration = async ({ context: qi }) => {
  /** Why a person should check this payment (an event that did not match it, a second charge). */
  await qi.addColumn("payments", "flag", { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn("payments", "flagged_at", { type: DataTypes.DATE, allowNull: true });
  /** Charged after the job's retainer was already paid by another payment; refunded automatically. */
  await qi.addColumn("payments", "duplicate", { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  /** When the reconciler last asked Stripe about this open payment (its claim on the row). */
  await qi.addColumn("payments", "checked_at", { type: DataTypes.DATE, allowNull: true });
  /** No person asked for an automatic refund. */
  await qi.sequelize.query("ALTER TABLE refunds ALTER COLUMN requested_by_id DROP NOT NULL");

  // Earlier attempts of a job that are still open are closed, newest kept: their sessions were
  // abandoned for a newer one; should one still be paid, the webhook refunds it as a duplicate.
  await qi.sequelize.query(`
    UPDATE payments SET status = 'expired', updated_at = now()
    WHERE status IN ('pending', 'failed')
      AND id NOT IN (SELECT DISTINCT ON (job_id) id FROM payments WHERE status IN ('pending', 'failed') ORDER BY job_id, created_at DESC, id)`);
  await qi.sequelize.query("CREATE UNIQUE INDEX payments_one_open_per_job ON payments (job_id) WHERE status IN ('pending', 'failed')");
  await qi.sequelize.query("CREATE INDEX payments_flagged ON payments (flagged_at DESC) WHERE flag IS NOT NULL");
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("DROP INDEX IF EXISTS payments_flagged");
  await qi.sequelize.query("DROP INDEX IF EXISTS payments_one_open_per_job");
  await qi.sequelize.query("UPDATE refunds r SET requested_by_id = p.created_by_id FROM payments p WHERE r.payment_id = p.id AND r.requested_by_id IS NULL");
  await qi.sequelize.query("ALTER TABLE refunds ALTER COLUMN requested_by_id SET NOT NULL");
  for (const column of ["checked_at", "duplicate", "flagged_at", "flag"]) await qi.removeColumn("payments", column);
};
