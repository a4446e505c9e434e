import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// The table rate-limiter-flexible's PostgreSQL store reads and writes (its own column names),
// made here so the schema only ever changes through migrations.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable("rate_limits", {
    key: { type: DataTypes.STRING(255), primaryKey: true },
    points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    expire: { type: DataTypes.BIGINT, allowNull: true },
  });
  await qi.addIndex("rate_limits", ["expire"]);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable("rate_limits");
};
