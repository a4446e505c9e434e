import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// How much of a job's paid retainer has been paid back, so lists and the job page can say
// "paid back" without adding up payments.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn("jobs", "retainer_refunded_cents", { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 });
  // Refunds recorded before this column existed.
  await qi.sequelize.query(
    "UPDATE jobs SET retainer_refunded_cents = p.refunded FROM (SELECT job_id, sum(refunded_cents) AS refunded FROM payments GROUP BY job_id) p WHERE p.job_id = jobs.id",
  );
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn("jobs", "retainer_refunded_cents");
};
