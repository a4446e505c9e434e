import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// A shop organisation reads no spec until an admin approves it: buyers' machines are
// confidential and anyone can sign up as a shop. Buyer and operator organisations have no
// approval (NULL); every shop has one, which the CHECK keeps true for every way a row is made.
// Shops that existed before this migration were already trusted, so they start approved.
export const up: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("CREATE TYPE enum_organisations_approval AS ENUM ('pending', 'approved', 'refused')");
  await qi.addColumn("organisations", "approval", { type: "enum_organisations_approval", allowNull: true });
  await qi.addColumn("organisations", "approval_reason", { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn("organisations", "approval_decided_by_id", {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: "users", key: "id" },
    onDelete: "SET NULL",
  });
  await qi.addColumn("organisations", "approval_decided_at", { type: DataTypes.DATE, allowNull: true });
  await qi.sequelize.query("UPDATE organisations SET approval = 'approved', approval_decided_at = now() WHERE kind = 'shop'");
  await qi.sequelize.query("ALTER TABLE organisations ADD CONSTRAINT organisations_shop_approval CHECK ((kind = 'shop') = (approval IS NOT NULL))");
  // A refusal always says why.
  await qi.sequelize.query(
    "ALTER TABLE organisations ADD CONSTRAINT organisations_refusal_reason CHECK (approval <> 'refused' OR length(approval_reason) > 0)",
  );
  // The admin's "waiting for approval" list.
  await qi.sequelize.query("CREATE INDEX organisations_pending ON organisations (created_at) WHERE approval = 'pending'");
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("DROP INDEX IF EXISTS organisations_pending");
  await qi.sequelize.query("ALTER TABLE organisations DROP CONSTRAINT IF EXISTS organisations_refusal_reason");
  await qi.sequelize.query("ALTER TABLE organisations DROP CONSTRAINT IF EXISTS organisations_shop_approval");
  for (const column of ["approval_decided_at", "approval_decided_by_id", "approval_reason", "approval"]) {
    await qi.removeColumn("organisations", column);
  }
  await qi.sequelize.query("DROP TYPE IF EXISTS enum_organisations_approval");
};
