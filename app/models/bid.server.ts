import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { sequelize } from "~/db.server";
import { centsColumn } from "./columns.server";
import { BID_STATUSES, type BidStatus } from "~/content/bid-status";
import type { AlternativeCircuit, OfferExtra, OfferTerms, OwnLine } from "~/content/offer-terms";

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
  /** free-text terms of versions offered before structured terms (migration 0013) */
  terms?: string;
  extras?: OfferExtra[];
  ownLines?: OwnLine[];
  offerTerms?: OfferTerms | null;
  alternativeCircuit?: AlternativeCircuit | null;
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
  /** the work beyond the bill, one answer per kind (none before migration 0013: nothing offered) */
  declare extras: CreationOptional<OfferExtra[]>;
  /** the shop's own lines, each for the whole order */
  declare ownLines: CreationOptional<OwnLine[]>;
  declare offerTerms: CreationOptional<OfferTerms | null>;
  declare alternativeCircuit: CreationOptional<AlternativeCircuit | null>;
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
    extras: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    ownLines: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    offerTerms: { type: DataTypes.JSONB, allowNull: true },
    alternativeCircuit: { type: DataTypes.JSONB, allowNull: true },
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

/** A document a shop attaches to its offer (quotation PDF, datasheet, drawing); the bytes are in file storage. */
export class BidDocument extends Model<InferAttributes<BidDocument>, InferCreationAttributes<BidDocument>> {
  declare id: CreationOptional<string>;
  declare bidId: string;
  declare fileName: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare storageKey: string;
  declare uploadedById: string;
  declare createdAt: CreationOptional<Date>;
}

BidDocument.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    bidId: { type: DataTypes.UUID, allowNull: false },
    fileName: { type: DataTypes.STRING(200), allowNull: false },
    contentType: { type: DataTypes.STRING(100), allowNull: false },
    sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
    storageKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    uploadedById: { type: DataTypes.UUID, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: "bid_documents", updatedAt: false },
);
