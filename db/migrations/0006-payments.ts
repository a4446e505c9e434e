import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") };
const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") };
const ref = (table: string, onDelete = "RESTRICT", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
});

// Retainer payments through Stripe Checkout, their refunds, and every webhook event received.
export const up: Migration = async ({ context: qi }) => {
  /** The buyer organisation's Stripe customer, made once and reused for every payment. */
  await qi.addColumn("organisations", "stripe_customer_id", { type: DataTypes.STRING(255), allowNull: true, unique: true });

  await qi.createTable("payments", {
    id,
    job_id: ref("jobs"),
    buyer_organisation_id: ref("organisations"),
    created_by_id: ref("users"),
    status: { type: DataTypes.ENUM("pending", "paid", "failed", "expired", "refunded", "partially_refunded"), allowNull: false, defaultValue: "pending" },
    amount_cents: { type: DataTypes.BIGINT, allowNull: false },
    refunded_cents: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    checkout_session_id: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    checkout_url: { type: DataTypes.TEXT, allowNull: true },
    payment_intent_id: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    customer_id: { type: DataTypes.STRING(255), allowNull: true },
    failure_message: { type: DataTypes.TEXT, allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("payments", ["job_id", "created_at"]);
  await qi.addIndex("payments", ["buyer_organisation_id", "created_at"]);

  await qi.createTable("refunds", {
    id,
    payment_id: ref("payments", "CASCADE"),
    requested_by_id: ref("users"),
    amount_cents: { type: DataTypes.BIGINT, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false },
    /** requested: sent to Stripe; recorded: its webhook has confirmed it; failed: Stripe refused. */
    status: { type: DataTypes.ENUM("requested", "recorded", "failed"), allowNull: false, defaultValue: "requested" },
    stripe_refund_id: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    failure_message: { type: DataTypes.TEXT, allowNull: true },
    recorded_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("refunds", ["payment_id", "created_at"]);

  /** Each webhook event once: the primary key is Stripe's event id, so a replay inserts nothing. */
  await qi.createTable("stripe_events", {
    id: { type: DataTypes.STRING(255), primaryKey: true },
    type: { type: DataTypes.STRING(100), allowNull: false },
    /** What the event did here: "applied", or why it changed nothing. */
    outcome: { type: DataTypes.STRING(200), allowNull: false },
    payload: { type: DataTypes.JSONB, allowNull: false },
    received_at: now,
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable("stripe_events");
  await qi.dropTable("refunds");
  await qi.dropTable("payments");
  for (const type of ["enum_payments_status", "enum_refunds_status"]) await qi.sequelize.query(`DROP TYPE IF EXISTS "${type}"`);
  await qi.removeColumn("organisations", "stripe_customer_id");
};
