import { DataTypes } from "sequelize";
import { ChangingRow, initRow } from "./columns.server";

/** A shop's question on a spec and the buyer's answer; the asker is never shown to other shops. */
export class SpecQuestion extends ChangingRow<SpecQuestion> {
  declare specId: string;
  declare organisationId: string;
  declare askedById: string;
  declare body: string;
  declare answer: string | null;
  declare answeredById: string | null;
  declare answeredAt: Date | null;
}

initRow(SpecQuestion, "spec_questions", {
  specId: { type: DataTypes.UUID, allowNull: false },
  organisationId: { type: DataTypes.UUID, allowNull: false },
  askedById: { type: DataTypes.UUID, allowNull: false },
  body: { type: DataTypes.TEXT, allowNull: false },
  answer: { type: DataTypes.TEXT, allowNull: true },
  answeredById: { type: DataTypes.UUID, allowNull: true },
  answeredAt: { type: DataTypes.DATE, allowNull: true },
});
