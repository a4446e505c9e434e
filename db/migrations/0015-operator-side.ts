import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") };

// The operator's side of issue 17: an audit log, notes on buyer accounts and company profiles.
export const up: Migration = async ({ context: qi }) => {
  // The audit log keeps its own copy of who did what to which record: it has no foreign keys,
  // so it stays readable (and complete) when the people and records it names change or go.
  await qi.createTable("audit_events", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") },
    at: now,
    action: { type: DataTypes.STRING(40), allowNull: false },
    /** Null for the system (the card service's webhook) and for a failed sign-in. */
    actor_id: { type: DataTypes.UUID, allowNull: true },
    actor_name: { type: DataTypes.STRING(120), allowNull: false },
    /** For a failed sign-in, the address typed (bounded); never a password. */
    actor_email: { type: DataTypes.STRING(254), allowNull: true },
    subject_type: { type: DataTypes.STRING(40), allowNull: true },
    subject_id: { type: DataTypes.STRING(64), allowNull: true },
    subject_label: { type: DataTypes.STRING(200), allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  });
  // The admin's list reads newest first, filtered by action or actor.
  await qi.addIndex("audit_events", ["at", "id"]);
  await qi.addIndex("audit_events", ["action", "at"]);
  await qi.addIndex("audit_events", ["actor_id", "at"]);

  // Notes an account's managers keep on a buyer organisation, with who wrote and last edited each.
  await qi.createTable("account_notes", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") },
    organisation_id: { type: DataTypes.UUID, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
    body: { type: DataTypes.TEXT, allowNull: false },
    author_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
    edited_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("account_notes", ["organisation_id", "created_at"]);

  // The company profile (region is already a column).
  await qi.addColumn("organisations", "address", { type: DataTypes.STRING(300), allowNull: true });
  await qi.addColumn("organisations", "tax_number", { type: DataTypes.STRING(40), allowNull: true });
  await qi.addColumn("organisations", "quote_contact_name", { type: DataTypes.STRING(120), allowNull: true });
  await qi.addColumn("organisations", "quote_contact_email", { type: DataTypes.STRING(254), allowNull: true });
  await qi.addColumn("organisations", "quote_contact_phone", { type: DataTypes.STRING(40), allowNull: true });
  // The admin's and the account managers' "unassigned" list.
  await qi.sequelize.query("CREATE INDEX organisations_unassigned ON organisations (created_at) WHERE kind = 'buyer' AND account_manager_id IS NULL");
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("DROP INDEX IF EXISTS organisations_unassigned");
  for (const column of ["quote_contact_phone", "quote_contact_email", "quote_contact_name", "tax_number", "address"]) {
    await qi.removeColumn("organisations", column);
  }
  await qi.dropTable("account_notes");
  await qi.dropTable("audit_events");
};
