import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { sequelize } from "~/db.server";
import { centsColumn } from "./columns.server";
import { BID_STATUSES, type BidStatus } from "~/content/bid-status";

/** One priced line of a bid: a line of the spec's bill of materials, or an alternative to it. */
export interface BidLine {
  key: string;
  item: string;
  quantity: number;
  specification: string;
  /** null while a draft leaves the line unpriced */
  unitPriceCents: number | null;
  alternative: boolean;
  alternativeDescription: string;
}

/** A bid as offered at one moment, kept in its history. */
export interface BidOffer {
  lines: BidLine[];
  units: number;
  setTotalCents: number;
  totalCents: number;
  currency: string;
  leadTimeWeeks: number | null;
  validUntil: string | null;
  terms: string;
  notes: string;
}

export class Bid extends Model<InferAttributes<Bid>, InferCreationAttributes<Bid>> {
  declare id: CreationOptional<string>;
  declare specId: string;
  declare organisationId: string;
  declare createdById: string;
  declare status: CreationOptional<BidStatus>;
  declare specRevision: number;
  declare version: CreationOptional<number>;
  declare currency: string;
  declare lines: CreationOptional<BidLine[]>;
  declare units: CreationOptional<number>;
  declare setTotalCents: CreationOptional<number>;
  declare totalCents: CreationOptional<number>;
  declare leadTimeWeeks: number | null;
  declare validUntil: string | null;
  declare terms: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare submittedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Bid.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    specId: { type: DataTypes.UUID, allowNull: false },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    createdById: { type: DataTypes.UUID, allowNull: false },
    status: { type: DataTypes.ENUM(...BID_STATUSES), allowNull: false, defaultValue: "draft" },
    specRevision: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    lines: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    units: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    setTotalCents: centsColumn("setTotalCents", 0),
    totalCents: centsColumn("totalCents", 0),
    leadTimeWeeks: { type: DataTypes.INTEGER, allowNull: true },
    validUntil: { type: DataTypes.DATEONLY, allowNull: true },
    terms: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    submittedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: "bids" },
);

export class BidVersion extends Model<InferAttributes<BidVersion>, InferCreationAttributes<BidVersion>> {
  declare id: CreationOptional<string>;
  declare bidId: string;
  declare version: number;
  declare event: "submitted" | "withdrawn";
  declare specRevision: number;
  declare offer: BidOffer;
  declare createdById: string;
  declare createdAt: CreationOptional<Date>;
}

BidVersion.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    bidId: { type: DataTypes.UUID, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    event: { type: DataTypes.ENUM("submitted", "withdrawn"), allowNull: false },
    specRevision: { type: DataTypes.INTEGER, allowNull: false },
    offer: { type: DataTypes.JSONB, allowNull: false },
    createdById: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: "bid_versions", updatedAt: false },
);
