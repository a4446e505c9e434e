import { DataTypes } from "sequelize";
import { Row, initRow, stringColumn, uuidColumn } from "./columns.server";
import { ROLES, type Role } from "~/auth/roles";

/** A password-reset link: only the SHA-256 of the token is stored; the link works once. */
export class PasswordReset extends Row<PasswordReset> {
  declare userId: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
}

initRow(PasswordReset, "password_resets", {
  userId: uuidColumn(),
  tokenHash: stringColumn(64, { unique: true }),
  expiresAt: { type: DataTypes.DATE, allowNull: false },
  usedAt: { type: DataTypes.DATE, allowNull: true },
});

/** An invitation into an organisation, sent by one of its members. */
export class Invitation extends Row<Invitation> {
  declare organisationId: string;
  declare invitedById: string;
  declare email: string;
  declare role: Role;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare revokedAt: Date | null;
}

initRow(Invitation, "invitations", {
  organisationId: uuidColumn(),
  invitedById: uuidColumn(),
  email: stringColumn(254),
  role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
  tokenHash: stringColumn(64, { unique: true }),
  expiresAt: { type: DataTypes.DATE, allowNull: false },
  acceptedAt: { type: DataTypes.DATE, allowNull: true },
  revokedAt: { type: DataTypes.DATE, allowNull: true },
});
