import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { sequelize } from "~/db.server";
import { stringColumn, uuidColumn } from "./columns.server";
import type { AuditAction, AuditSubjectType } from "~/content/audit-actions";

/** Plain values only, so an entry reads the same whatever becomes of the records it names. */
export type AuditDetails = Record<string, string | number | boolean | null>;

/**
 * One line of the audit log. It copies names and ids instead of referring to rows (no foreign
 * keys), so it stays readable when the person or record it speaks of is renamed or removed.
 */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<string>;
  declare at: CreationOptional<Date>;
  declare action: AuditAction;
  declare actorId: string | null;
  declare actorName: string;
  declare actorEmail: string | null;
  declare subjectType: AuditSubjectType | null;
  declare subjectId: string | null;
  declare subjectLabel: string | null;
  declare details: AuditDetails;
}

AuditEvent.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    action: stringColumn(40),
    actorId: uuidColumn({ allowNull: true }),
    actorName: stringColumn(120),
    actorEmail: stringColumn(254, { allowNull: true }),
    subjectType: stringColumn(40, { allowNull: true }),
    subjectId: stringColumn(64, { allowNull: true }),
    subjectLabel: stringColumn(200, { allowNull: true }),
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  },
  { sequelize, tableName: "audit_events", timestamps: false },
);
