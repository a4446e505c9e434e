import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { ChangingRow, centsColumn, initRow, stringColumn, uuidColumn } from "./columns.server";
import { sequelize } from "~/db.server";
import { PAYMENT_STATUSES, type PaymentStatus } from "~/content/payment-status";

export type PaymentPurpose = "retainer" | "balance";

/** One attempt to pay a job's retainer or balance through a Stripe Checkout Session. */
export class Payment extends ChangingRow<Payment> {
  declare jobId: string;
  /** What of the job's price it pays: the retainer, or the balance after the handover. */
  declare purpose: CreationOptional<PaymentPurpose>;
  declare buyerOrganisationId: string;
  declare createdById: string;
  declare status: CreationOptional<PaymentStatus>;
  declare amountCents: number;
  declare refundedCents: CreationOptional<number>;
  declare currency: string;
  declare checkoutSessionId: string | null;
  declare checkoutUrl: string | null;
  declare paymentIntentId: string | null;
  declare customerId: string | null;
  declare failureMessage: string | null;
  declare paidAt: Date | null;
  /** Why a person should check this payment; null when nothing is amiss. */
  declare flag: CreationOptional<string | null>;
  declare flaggedAt: CreationOptional<Date | null>;
  /** A second charge for a retainer already paid: refunded automatically, not the job's money. */
  declare duplicate: CreationOptional<boolean>;
  /** When the reconciler last asked Stripe about it. */
  declare checkedAt: CreationOptional<Date | null>;
}

/** Attempts that may still take a card; the database allows one per job and purpose (payments_one_open_per_job). */
export const OPEN_PAYMENT_STATUSES = ["pending", "failed"] as const satisfies readonly PaymentStatus[];

initRow(Payment, "payments", {
  jobId: uuidColumn(),
  purpose: stringColumn(10, { defaultValue: "retainer" }),
  buyerOrganisationId: uuidColumn(),
  createdById: uuidColumn(),
  status: { type: DataTypes.ENUM(...PAYMENT_STATUSES), allowNull: false, defaultValue: "pending" },
  amountCents: centsColumn("amountCents"),
  refundedCents: centsColumn("refundedCents", 0),
  currency: stringColumn(3),
  checkoutSessionId: stringColumn(255, { allowNull: true }),
  checkoutUrl: { type: DataTypes.TEXT, allowNull: true },
  paymentIntentId: stringColumn(255, { allowNull: true }),
  customerId: stringColumn(255, { allowNull: true }),
  failureMessage: { type: DataTypes.TEXT, allowNull: true },
  paidAt: { type: DataTypes.DATE, allowNull: true },
  flag: { type: DataTypes.TEXT, allowNull: true },
  flaggedAt: { type: DataTypes.DATE, allowNull: true },
  duplicate: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  checkedAt: { type: DataTypes.DATE, allowNull: true },
});

export class Refund extends ChangingRow<Refund> {
  declare paymentId: string;
  /** Null for a refund Tenderflow made by itself (a second charge). */
  declare requestedById: string | null;
  declare amountCents: number;
  declare reason: string;
  declare status: CreationOptional<"requested" | "recorded" | "failed">;
  declare stripeRefundId: string | null;
  declare failureMessage: string | null;
  declare recordedAt: Date | null;
}

initRow(Refund, "refunds", {
  paymentId: uuidColumn(),
  requestedById: uuidColumn({ allowNull: true }),
  amountCents: centsColumn("amountCents"),
  reason: { type: DataTypes.TEXT, allowNull: false },
  status: { type: DataTypes.ENUM("requested", "recorded", "failed"), allowNull: false, defaultValue: "requested" },
  stripeRefundId: stringColumn(255, { allowNull: true }),
  failureMessage: { type: DataTypes.TEXT, allowNull: true },
  recordedAt: { type: DataTypes.DATE, allowNull: true },
});

/** A webhook event as received; its id is Stripe's, so each is handled once. */
export class StripeEvent extends Model<InferAttributes<StripeEvent>, InferCreationAttributes<StripeEvent>> {
  declare id: string;
  declare type: string;
  declare outcome: string;
  declare payload: Record<string, unknown>;
  declare receivedAt: CreationOptional<Date>;
}

StripeEvent.init(
  {
    id: { type: DataTypes.STRING(255), primaryKey: true },
    type: stringColumn(100),
    outcome: stringColumn(200),
    payload: { type: DataTypes.JSONB, allowNull: false },
    receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  },
  { sequelize, tableName: "stripe_events", timestamps: false },
);
