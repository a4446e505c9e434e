import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// How much of a job's paid retainer has been paid back, so lists and the job page can say
// "paid back" without adding up payments.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn("jobs", "retainer_refunded_cents", { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn("jobs", "retainer_refunded_cents");
};
