import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
} from "sequelize";
import { sequelize } from "~/db.server";
import { ORGANISATION_KINDS, type OrganisationKind } from "~/auth/roles";

export class Organisation extends Model<InferAttributes<Organisation>, InferCreationAttributes<Organisation>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare kind: OrganisationKind;
  declare region: string | null;
  /** The operator's account manager who follows this buyer account. */
  declare accountManagerId: ForeignKey<string> | null;
  /** The Stripe customer of a buyer organisation, made with its first payment. */
  declare stripeCustomerId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Organisation.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    kind: { type: DataTypes.ENUM(...ORGANISATION_KINDS), allowNull: false },
    region: { type: DataTypes.STRING(80), allowNull: true },
    accountManagerId: { type: DataTypes.UUID, allowNull: true },
    stripeCustomerId: { type: DataTypes.STRING(255), allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: "organisations" },
);
