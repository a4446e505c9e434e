import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import { sequelize } from "~/db.server";

/** A shop's question on a spec and the buyer's answer; the asker is never shown to other shops. */
export class SpecQuestion extends Model<InferAttributes<SpecQuestion>, InferCreationAttributes<SpecQuestion>> {
  declare id: CreationOptional<string>;
  declare specId: string;
  declare organisationId: string;
  declare askedById: string;
  declare body: string;
  declare answer: string | null;
  declare answeredById: string | null;
  declare answeredAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SpecQuestion.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    specId: { type: DataTypes.UUID, allowNull: false },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    askedById: { type: DataTypes.UUID, allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    answer: { type: DataTypes.TEXT, allowNull: true },
    answeredById: { type: DataTypes.UUID, allowNull: true },
    answeredAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: "spec_questions" },
);
