import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { sequelize } from "~/db.server";
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
    action: { type: DataTypes.STRING(40), allowNull: false },
    actorId: { type: DataTypes.UUID, allowNull: true },
    actorName: { type: DataTypes.STRING(120), allowNull: false },
    actorEmail: { type: DataTypes.STRING(254), allowNull: true },
    subjectType: { type: DataTypes.STRING(40), allowNull: true },
    subjectId: { type: DataTypes.STRING(64), allowNull: true },
    subjectLabel: { type: DataTypes.STRING(200), allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  },
  { sequelize, tableName: "audit_events", timestamps: false },
);
