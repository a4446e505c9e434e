import { DataTypes, type CreationOptional } from "sequelize";
import { ChangingRow, Row, StoredFileRow, centsColumn, initRow, storedFileColumns, stringColumn, uuidColumn } from "./columns.server";
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

export class Bid extends ChangingRow<Bid> {
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
}

initRow(Bid, "bids", {
  specId: uuidColumn(),
  organisationId: uuidColumn(),
  createdById: uuidColumn(),
  status: { type: DataTypes.ENUM(...BID_STATUSES), allowNull: false, defaultValue: "draft" },
  specRevision: { type: DataTypes.INTEGER, allowNull: false },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  currency: stringColumn(3),
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
});

export class BidVersion extends Row<BidVersion> {
  declare bidId: string;
  declare version: number;
  declare event: "submitted" | "withdrawn";
  declare specRevision: number;
  declare offer: BidOffer;
  declare createdById: string;
}

initRow(BidVersion, "bid_versions", {
  bidId: uuidColumn(),
  version: { type: DataTypes.INTEGER, allowNull: false },
  event: { type: DataTypes.ENUM("submitted", "withdrawn"), allowNull: false },
  specRevision: { type: DataTypes.INTEGER, allowNull: false },
  offer: { type: DataTypes.JSONB, allowNull: false },
  createdById: uuidColumn(),
});

/** A document a shop attaches to its offer (quotation PDF, datasheet, drawing). */
export class BidDocument extends StoredFileRow<BidDocument> {
  declare bidId: string;
}

initRow(BidDocument, "bid_documents", { bidId: uuidColumn(), ...storedFileColumns() });
