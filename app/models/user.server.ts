import { DataTypes, type CreationOptional, type NonAttribute } from "sequelize";
import { ChangingRow, initRow, stringColumn, uuidColumn } from "./columns.server";
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
  email: stringColumn(254, { unique: true }),
  name: stringColumn(120),
  passwordHash: stringColumn(100),
  role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
  active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
  unitSystem: { type: DataTypes.ENUM(...UNIT_SYSTEMS), allowNull: false, defaultValue: "metric" },
  lastSignInAt: { type: DataTypes.DATE, allowNull: true },
});
