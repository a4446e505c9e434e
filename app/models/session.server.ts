import { DataTypes, Model, Op, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Transaction } from "sequelize";
import { sequelize } from "~/db.server";
import { stringColumn, uuidColumn } from "./columns.server";

/**
 * A browser's session, kept here so it can be ended from anywhere: the cookie holds only a
 * random id, and the row is found by that id's SHA-256.
 */
export class UserSession extends Model<InferAttributes<UserSession>, InferCreationAttributes<UserSession>> {
  declare id: string;
  declare userId: string | null;
  declare data: Record<string, unknown>;
  declare userAgent: string | null;
  declare createdAt: CreationOptional<Date>;
  declare lastSeenAt: CreationOptional<Date>;
  declare expiresAt: Date;
  declare revokedAt: Date | null;

  /** Ends every live session of a user (sign out everywhere, password reset, deactivation). */
  static async revokeAllOf(userId: string, transaction?: Transaction) {
    const [count] = await UserSession.update({ revokedAt: new Date() }, { where: { userId, revokedAt: null }, transaction });
    return count;
  }

  /** Rows a day past their end: nothing reads them any more. */
  static purgeEnded() {
    const dayAgo = new Date(Date.now() - 86_400_000);
    return UserSession.destroy({ where: { [Op.or]: [{ expiresAt: { [Op.lt]: dayAgo } }, { revokedAt: { [Op.lt]: dayAgo } }] } });
  }
}

UserSession.init(
  {
    id: { type: DataTypes.STRING(64), primaryKey: true },
    userId: uuidColumn({ allowNull: true }),
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    userAgent: stringColumn(300, { allowNull: true }),
    createdAt: DataTypes.DATE,
    lastSeenAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
  },
  { sequelize, tableName: "sessions", updatedAt: false },
);
