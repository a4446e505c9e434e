import { DataTypes, type Model } from "sequelize";

/**
 * A money column in integer cents. pg returns BIGINT as text; amounts stay far below 2^53, so
 * they are read back as exact numbers.
 */
export const centsColumn = (name: string, defaultValue?: number) => ({
  type: DataTypes.BIGINT,
  allowNull: false,
  ...(defaultValue === undefined ? {} : { defaultValue }),
  get(this: Model) {
    return Number(this.getDataValue(name));
  },
});
