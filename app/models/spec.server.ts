import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { sequelize } from "~/db.server";
import type { UnitSystem } from "~/units/systems";
import type { MachineDesign } from "~/hydraulics/machine-design";

import { SPEC_STATUSES, type SpecStatus } from "~/content/spec-status";

export { SPEC_STATUSES, type SpecStatus };

export type SpecAnswers = Record<string, Record<string, string>>;

export class Spec extends Model<InferAttributes<Spec>, InferCreationAttributes<Spec>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare createdById: string;
  declare title: CreationOptional<string>;
  declare status: CreationOptional<SpecStatus>;
  declare answers: CreationOptional<SpecAnswers>;
  declare unitSystem: CreationOptional<UnitSystem>;
  declare completedSteps: CreationOptional<string[]>;
  declare currentRevision: CreationOptional<number>;
  /** A published spec whose answers are being edited towards its next revision. */
  declare revising: CreationOptional<boolean>;
  declare bidDeadline: Date | null;
  declare retainerPercent: string | null;
  declare deliveryRegion: string | null;
  declare publishedAt: Date | null;
  /** Every bid on the spec is priced in this currency (ISO 4217). */
  declare currency: CreationOptional<string>;
  declare unitsWanted: number | null;
  /** Copied from the current revision's design, for filtering open specs. */
  declare reliefSettingBar: number | null;
  declare pumpFlowLpm: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Spec.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    createdById: { type: DataTypes.UUID, allowNull: false },
    title: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
    status: { type: DataTypes.ENUM(...SPEC_STATUSES), allowNull: false, defaultValue: "draft" },
    answers: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    unitSystem: { type: DataTypes.ENUM("metric", "us"), allowNull: false, defaultValue: "metric" },
    completedSteps: { type: DataTypes.ARRAY(DataTypes.STRING(20)), allowNull: false, defaultValue: [] },
    currentRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    revising: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    bidDeadline: { type: DataTypes.DATE, allowNull: true },
    retainerPercent: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
    deliveryRegion: { type: DataTypes.STRING(80), allowNull: true },
    publishedAt: { type: DataTypes.DATE, allowNull: true },
    currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: "EUR" },
    unitsWanted: { type: DataTypes.INTEGER, allowNull: true },
    reliefSettingBar: { type: DataTypes.REAL, allowNull: true },
    pumpFlowLpm: { type: DataTypes.REAL, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: "specs" },
);

export interface SpecAxis {
  name: string;
  requirements: unknown;
  design: unknown;
}

export class SpecRevision extends Model<InferAttributes<SpecRevision>, InferCreationAttributes<SpecRevision>> {
  declare id: CreationOptional<string>;
  declare specId: string;
  declare number: number;
  declare axes: SpecAxis[];
  /** A machine of several axes: its design over the whole cycle (null for a spec of one axis). */
  declare machine: CreationOptional<MachineDesign | null>;
  declare answers: SpecAnswers;
  declare unitSystem: UnitSystem;
  declare engineVersion: string;
  declare createdById: string;
  declare createdAt: CreationOptional<Date>;
}

SpecRevision.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    specId: { type: DataTypes.UUID, allowNull: false },
    number: { type: DataTypes.INTEGER, allowNull: false },
    axes: { type: DataTypes.JSONB, allowNull: false },
    machine: { type: DataTypes.JSONB, allowNull: true },
    answers: { type: DataTypes.JSONB, allowNull: false },
    unitSystem: { type: DataTypes.ENUM("metric", "us"), allowNull: false },
    engineVersion: { type: DataTypes.STRING(20), allowNull: false },
    createdById: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: "spec_revisions", updatedAt: false },
);

export class SpecAttachment extends Model<InferAttributes<SpecAttachment>, InferCreationAttributes<SpecAttachment>> {
  declare id: CreationOptional<string>;
  declare specId: string;
  declare fileName: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare storageKey: string;
  declare uploadedById: string;
  declare createdAt: CreationOptional<Date>;
}

SpecAttachment.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    specId: { type: DataTypes.UUID, allowNull: false },
    fileName: { type: DataTypes.STRING(200), allowNull: false },
    contentType: { type: DataTypes.STRING(100), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    storageKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    uploadedById: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: "spec_attachments", updatedAt: false },
);
