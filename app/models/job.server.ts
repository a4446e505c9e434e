import { DataTypes, type CreationOptional } from "sequelize";
import { ChangingRow, Row, StoredFileRow, centsColumn, initRow, storedFileColumns, stringColumn, uuidColumn } from "./columns.server";
import type { MilestoneKey } from "~/content/job-milestones";
import type { OrderDocument } from "~/content/order-document";

export type BalanceMethod = "card" | "bank_transfer";

/** An awarded bid being built and delivered. */
export class Job extends ChangingRow<Job> {
  declare specId: string;
  declare bidId: string;
  declare buyerOrganisationId: string;
  declare shopOrganisationId: string;
  declare awardedById: string;
  declare awardedAt: CreationOptional<Date>;
  declare currency: string;
  declare totalCents: number;
  declare retainerPercent: string;
  declare retainerCents: number;
  declare retainerPaidAt: Date | null;
  /** Paid back by refunds so far (recorded from their webhook). */
  declare retainerRefundedCents: CreationOptional<number>;
  /** The latest milestone reached, or null before the first. */
  declare stage: MilestoneKey | null;
  /** The buyer accepted the handover: the job is closed. */
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedById: CreationOptional<string | null>;
  /** The rest of the price (total − retainer): paid by card, or recorded as a bank transfer. */
  declare balancePaidAt: CreationOptional<Date | null>;
  declare balanceMethod: CreationOptional<BalanceMethod | null>;
  declare balanceReference: CreationOptional<string | null>;
}

initRow(Job, "jobs", {
  specId: { type: DataTypes.UUID, allowNull: false, unique: true },
  bidId: { type: DataTypes.UUID, allowNull: false, unique: true },
  buyerOrganisationId: uuidColumn(),
  shopOrganisationId: uuidColumn(),
  awardedById: uuidColumn(),
  awardedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  currency: stringColumn(3),
  totalCents: centsColumn("totalCents"),
  retainerPercent: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
  retainerCents: centsColumn("retainerCents"),
  retainerPaidAt: { type: DataTypes.DATE, allowNull: true },
  retainerRefundedCents: centsColumn("retainerRefundedCents", 0),
  stage: stringColumn(30, { allowNull: true }),
  acceptedAt: { type: DataTypes.DATE, allowNull: true },
  acceptedById: uuidColumn({ allowNull: true }),
  balancePaidAt: { type: DataTypes.DATE, allowNull: true },
  balanceMethod: stringColumn(20, { allowNull: true }),
  balanceReference: stringColumn(200, { allowNull: true }),
});

export class JobMilestone extends ChangingRow<JobMilestone> {
  declare jobId: string;
  declare key: MilestoneKey;
  declare position: number;
  declare targetDate: string | null;
  declare reachedAt: Date | null;
  declare reachedById: string | null;
}

initRow(JobMilestone, "job_milestones", {
  jobId: uuidColumn(),
  key: stringColumn(30),
  position: { type: DataTypes.INTEGER, allowNull: false },
  targetDate: { type: DataTypes.DATEONLY, allowNull: true },
  reachedAt: { type: DataTypes.DATE, allowNull: true },
  reachedById: uuidColumn({ allowNull: true }),
});

export type JobEventKind =
  | "awarded"
  | "milestone_reached"
  | "milestone_undone"
  | "target_changed"
  | "progress_note"
  | "manager_note"
  | "retainer_paid"
  | "retainer_refunded"
  | "handover_accepted"
  | "handover_problem"
  | "file_added"
  | "balance_paid"
  | "balance_refunded";

/** One entry of a job's history: who did what, when. */
export class JobEvent extends Row<JobEvent> {
  declare jobId: string;
  declare userId: string;
  declare kind: JobEventKind;
  declare milestone: MilestoneKey | null;
  declare detail: CreationOptional<Record<string, unknown>>;
  declare body: CreationOptional<string>;
  /** "operator": an account manager's internal note, not shown to buyer or shop. */
  declare visibility: CreationOptional<"all" | "operator">;
}

initRow(JobEvent, "job_events", {
  jobId: uuidColumn(),
  userId: uuidColumn(),
  kind: stringColumn(30),
  milestone: stringColumn(30, { allowNull: true }),
  detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  body: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
  visibility: { type: DataTypes.ENUM("all", "operator"), allowNull: false, defaultValue: "all" },
});

export type JobFileKind = "test_certificate" | "approved_drawing" | "problem_photo";

/** A file exchanged on a job: who uploaded it and when are part of the record. */
export class JobFile extends StoredFileRow<JobFile> {
  declare jobId: string;
  declare kind: JobFileKind;
  /** The problem report a photo belongs to. */
  declare eventId: string | null;
}

initRow(JobFile, "job_files", {
  jobId: uuidColumn(),
  kind: stringColumn(30),
  ...storedFileColumns(false),
  eventId: uuidColumn({ allowNull: true }),
});

/** The order confirmation made at the award; the database refuses any update of it. */
export class OrderConfirmation extends Row<OrderConfirmation> {
  declare jobId: string;
  declare number: string;
  declare document: OrderDocument;
}

initRow(OrderConfirmation, "order_confirmations", {
  jobId: { type: DataTypes.UUID, allowNull: false, unique: true },
  number: stringColumn(20, { unique: true }),
  document: { type: DataTypes.JSONB, allowNull: false },
});
