import { DataTypes } from "sequelize";
import { ChangingRow, initRow, uuidColumn } from "./columns.server";

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
  specId: uuidColumn(),
  organisationId: uuidColumn(),
  askedById: uuidColumn(),
  body: { type: DataTypes.TEXT, allowNull: false },
  answer: { type: DataTypes.TEXT, allowNull: true },
  answeredById: uuidColumn({ allowNull: true }),
  answeredAt: { type: DataTypes.DATE, allowNull: true },
});
