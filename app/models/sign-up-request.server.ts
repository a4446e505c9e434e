import { DataTypes } from "sequelize";
import { Row, initRow } from "./columns.server";

/**
 * A sign-up waiting for its address to be confirmed: the account is made only when the link
 * mailed to the address is used, so the sign-up page answers alike for known and new addresses.
 */
export class SignUpRequest extends Row<SignUpRequest> {
  declare email: string;
  declare kind: "buyer" | "shop";
  declare organisationName: string;
  declare name: string;
  declare passwordHash: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
}

initRow(SignUpRequest, "sign_up_requests", {
  email: { type: DataTypes.STRING(254), allowNull: false },
  kind: { type: DataTypes.ENUM("buyer", "shop"), allowNull: false },
  organisationName: { type: DataTypes.STRING(120), allowNull: false },
  name: { type: DataTypes.STRING(120), allowNull: false },
  passwordHash: { type: DataTypes.STRING(100), allowNull: false },
  tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
  expiresAt: { type: DataTypes.DATE, allowNull: false },
  usedAt: { type: DataTypes.DATE, allowNull: true },
});
