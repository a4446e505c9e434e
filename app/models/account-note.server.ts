import { DataTypes, type NonAttribute } from "sequelize";
import { ChangingRow, initRow, uuidColumn } from "./columns.server";
import { User } from "./user.server";

/** A note operator staff keep on a buyer account, with who wrote it and who last edited it, and when. */
export class AccountNote extends ChangingRow<AccountNote> {
  declare organisationId: string;
  declare body: string;
  declare authorId: string | null;
  declare editedById: string | null;
  declare author?: NonAttribute<User | null>;
  declare editedBy?: NonAttribute<User | null>;
}

initRow(AccountNote, "account_notes", {
  organisationId: uuidColumn(),
  body: { type: DataTypes.TEXT, allowNull: false },
  authorId: uuidColumn({ allowNull: true }),
  editedById: uuidColumn({ allowNull: true }),
});

// Kept here rather than in index.server.ts: nothing else joins to notes.
AccountNote.belongsTo(User, { foreignKey: "authorId", as: "author" });
AccountNote.belongsTo(User, { foreignKey: "editedById", as: "editedBy" });
