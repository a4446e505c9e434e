import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") };

// Sessions kept on the server, so one can be ended from anywhere, and sign-ups that wait for
// the address to be confirmed.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable("sessions", {
    /** SHA-256 of the id in the cookie: a leaked table signs nobody in. */
    id: { type: DataTypes.STRING(64), primaryKey: true },
    /** Empty for a visitor's session that only carries a message to the next page. */
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    user_agent: { type: DataTypes.STRING(300), allowNull: true },
    created_at: now,
    last_seen_at: now,
    expires_at: { type: DataTypes.DATE, allowNull: false },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.addIndex("sessions", ["user_id"], { where: { revoked_at: null } });
  await qi.addIndex("sessions", ["expires_at"]);

  await qi.createTable("sign_up_requests", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") },
    email: { type: DataTypes.STRING(254), allowNull: false },
    kind: { type: "enum_organisations_kind", allowNull: false },
    organisation_name: { type: DataTypes.STRING(120), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
  });
  await qi.addIndex("sign_up_requests", ["expires_at"]);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable("sign_up_requests");
  await qi.dropTable("sessions");
};
