import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// A published spec being revised: its answers are edited in the form while shops keep seeing
// the last published revision, until the buyer publishes the next one.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn("specs", "revising", { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn("specs", "revising");
};
