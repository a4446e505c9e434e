import { DataTypes, type CreationOptional } from "sequelize";
import { ChangingRow, Row, StoredFileRow, initRow, storedFileColumns, stringColumn, uuidColumn } from "./columns.server";
import type { UnitSystem } from "~/units/systems";
import type { MachineDesign } from "~/hydraulics/machine-design";

import { SPEC_STATUSES, type SpecStatus } from "~/content/spec-status";

export { SPEC_STATUSES, type SpecStatus };

export type SpecAnswers = Record<string, Record<string, string>>;

export class Spec extends ChangingRow<Spec> {
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
}

initRow(Spec, "specs", {
  organisationId: uuidColumn(),
  createdById: uuidColumn(),
  title: stringColumn(120, { defaultValue: "" }),
  status: { type: DataTypes.ENUM(...SPEC_STATUSES), allowNull: false, defaultValue: "draft" },
  answers: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
  unitSystem: { type: DataTypes.ENUM("metric", "us"), allowNull: false, defaultValue: "metric" },
  completedSteps: { type: DataTypes.ARRAY(DataTypes.STRING(20)), allowNull: false, defaultValue: [] },
  currentRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  revising: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  bidDeadline: { type: DataTypes.DATE, allowNull: true },
  retainerPercent: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
  deliveryRegion: stringColumn(80, { allowNull: true }),
  publishedAt: { type: DataTypes.DATE, allowNull: true },
  currency: stringColumn(3, { defaultValue: "EUR" }),
  unitsWanted: { type: DataTypes.INTEGER, allowNull: true },
  reliefSettingBar: { type: DataTypes.REAL, allowNull: true },
  pumpFlowLpm: { type: DataTypes.REAL, allowNull: true },
});

export interface SpecAxis {
  name: string;
  requirements: unknown;
  design: unknown;
}

export class SpecRevision extends Row<SpecRevision> {
  declare specId: string;
  declare number: number;
  declare axes: SpecAxis[];
  /** A machine of several axes: its design over the whole cycle (null for a spec of one axis). */
  declare machine: CreationOptional<MachineDesign | null>;
  declare answers: SpecAnswers;
  declare unitSystem: UnitSystem;
  declare engineVersion: string;
  declare createdById: string;
}

initRow(SpecRevision, "spec_revisions", {
  specId: uuidColumn(),
  number: { type: DataTypes.INTEGER, allowNull: false },
  axes: { type: DataTypes.JSONB, allowNull: false },
  machine: { type: DataTypes.JSONB, allowNull: true },
  answers: { type: DataTypes.JSONB, allowNull: false },
  unitSystem: { type: DataTypes.ENUM("metric", "us"), allowNull: false },
  engineVersion: stringColumn(20),
  createdById: uuidColumn(),
});

/** A drawing or document a buyer attaches to a spec. */
export class SpecAttachment extends StoredFileRow<SpecAttachment> {
  declare specId: string;
}

initRow(SpecAttachment, "spec_attachments", { specId: uuidColumn(), ...storedFileColumns() });
