import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from "sequelize";
import { sequelize } from "~/db.server";
import { User } from "./user.server";

/** A note operator staff keep on a buyer account, with who wrote it and who last edited it, and when. */
export class AccountNote extends Model<InferAttributes<AccountNote>, InferCreationAttributes<AccountNote>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare body: string;
  declare authorId: string | null;
  declare editedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;
  declare editedBy?: NonAttribute<User | null>;
}

AccountNote.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    organisationId: { type: DataTypes.UUID, allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    authorId: { type: DataTypes.UUID, allowNull: true },
    editedById: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: "account_notes" },
);

// Kept here rather than in index.server.ts: nothing else joins to notes.
AccountNote.belongsTo(User, { foreignKey: "authorId", as: "author" });
AccountNote.belongsTo(User, { foreignKey: "editedById", as: "editedBy" });
