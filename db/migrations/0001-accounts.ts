import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") };
const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") };

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable("organisations", {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.ENUM("buyer", "shop", "operator"), allowNull: false },
    region: { type: DataTypes.STRING(80), allowNull: true },
    account_manager_id: { type: DataTypes.UUID, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.createTable("users", {
    id,
    organisation_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "organisations", key: "id" },
      onDelete: "CASCADE",
    },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    role: { type: DataTypes.ENUM("buyer", "shop", "account_manager", "admin"), allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    unit_system: { type: DataTypes.ENUM("metric", "us"), allowNull: false, defaultValue: "metric" },
    last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("users", ["organisation_id"]);
  await qi.addConstraint("organisations", {
    fields: ["account_manager_id"],
    type: "foreign key",
    name: "organisations_account_manager_fk",
    references: { table: "users", field: "id" },
    onDelete: "SET NULL",
    onUpdate: "CASCADE",
  });
  await qi.addIndex("organisations", ["account_manager_id"]);

  await qi.createTable("password_resets", {
    id,
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
  });
  await qi.createTable("invitations", {
    id,
    organisation_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: "organisations", key: "id" },
      onDelete: "CASCADE",
    },
    invited_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: "enum_users_role", allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
  });
  await qi.addIndex("invitations", ["organisation_id"]);

  await qi.createTable("outbox_mails", {
    id,
    to: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(200), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.ENUM("pending", "sent", "failed"), allowNull: false, defaultValue: "pending" },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    next_attempt_at: now,
    last_error: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  // The sender polls for due mail; a partial index keeps that cheap however much was sent.
  await qi.sequelize.query("CREATE INDEX outbox_mails_due ON outbox_mails (next_attempt_at) WHERE status = 'pending'");
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable("outbox_mails");
  await qi.dropTable("invitations");
  await qi.dropTable("password_resets");
  await qi.removeConstraint("organisations", "organisations_account_manager_fk");
  await qi.dropTable("users");
  await qi.dropTable("organisations");
  for (const type of ["enum_outbox_mails_status", "enum_users_role", "enum_users_unit_system", "enum_organisations_kind"]) {
    await qi.sequelize.query(`DROP TYPE IF EXISTS "${type}"`);
  }
};
