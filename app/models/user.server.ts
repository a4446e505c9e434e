import { DataTypes, type CreationOptional, type NonAttribute } from "sequelize";
import { ChangingRow, initRow, uuidColumn } from "./columns.server";
import { ROLES, type Role } from "~/auth/roles";
import { UNIT_SYSTEMS, type UnitSystem } from "~/units/systems";
import type { Organisation } from "./organisation.server";

export class User extends ChangingRow<User> {
  declare organisationId: string;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  declare role: Role;
  declare active: CreationOptional<boolean>;
  declare unitSystem: CreationOptional<UnitSystem>;
  declare lastSignInAt: Date | null;
  declare organisation?: NonAttribute<Organisation>;
}

initRow(User, "users", {
  organisationId: uuidColumn(),
  email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
  name: { type: DataTypes.STRING(120), allowNull: false },
  passwordHash: { type: DataTypes.STRING(100), allowNull: false },
  role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
  active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
  unitSystem: { type: DataTypes.ENUM(...UNIT_SYSTEMS), allowNull: false, defaultValue: "metric" },
  lastSignInAt: { type: DataTypes.DATE, allowNull: true },
});
