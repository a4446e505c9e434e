import { DataTypes, type CreationOptional } from "sequelize";
import { ChangingRow, initRow, stringColumn, uuidColumn } from "./columns.server";

const OUTBOX_STATUSES = ["pending", "sent", "failed"] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

/**
 * The order mail is sent in (lower first): account mail a person is waiting for at the sign-in
 * page (password reset, invitation, account notices), then activity on their work, then
 * announcements sent to many people at once.
 */
export const MAIL_PRIORITIES = { account: 0, activity: 1, announcement: 2 } as const;
export type MailPriority = keyof typeof MAIL_PRIORITIES;

/** An e-mail and how its delivery went. Written in the same transaction as the change it reports, with the job that sends it. */
export class OutboxMail extends ChangingRow<OutboxMail> {
  declare to: string;
  declare subject: string;
  declare text: string;
  declare html: string | null;
  declare status: CreationOptional<OutboxStatus>;
  /** A value of MAIL_PRIORITIES. */
  declare priority: CreationOptional<number>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare lastError: string | null;
  /** The pg-boss job that delivers it (its latest, after "Send again"). */
  declare jobId: CreationOptional<string | null>;
  declare sentAt: Date | null;
}

initRow(OutboxMail, "outbox_mails", {
  to: stringColumn(254),
  subject: stringColumn(200),
  text: { type: DataTypes.TEXT, allowNull: false },
  html: { type: DataTypes.TEXT, allowNull: true },
  status: { type: DataTypes.ENUM(...OUTBOX_STATUSES), allowNull: false, defaultValue: "pending" },
  priority: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: MAIL_PRIORITIES.activity },
  attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  lastError: { type: DataTypes.TEXT, allowNull: true },
  jobId: uuidColumn({ allowNull: true }),
  sentAt: { type: DataTypes.DATE, allowNull: true },
});
