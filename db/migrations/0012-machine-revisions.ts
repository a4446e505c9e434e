import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// A revision of a spec of several axes keeps the machine's design beside the per-axis entries:
// one power unit sized over the machine's cycle, one bill shops price. A spec of one axis keeps
// NULL here and reads its design from its single axis, as every revision before this did.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn("spec_revisions", "machine", { type: DataTypes.JSONB, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn("spec_revisions", "machine");
};
