import { DataTypes } from "sequelize";
import { Row, initRow, stringColumn } from "./columns.server";

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
  email: stringColumn(254),
  kind: { type: DataTypes.ENUM("buyer", "shop"), allowNull: false },
  organisationName: stringColumn(120),
  name: stringColumn(120),
  passwordHash: stringColumn(100),
  tokenHash: stringColumn(64, { unique: true }),
  expiresAt: { type: DataTypes.DATE, allowNull: false },
  usedAt: { type: DataTypes.DATE, allowNull: true },
});
