import {
  DataTypes,
  Model,
  type Attributes,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type InitOptions,
  type ModelAttributes,
  type ModelStatic,
  type DataType,
} from "sequelize";
import { sequelize } from "~/db.server";

// What most of Tenderflow's tables share, written once: a uuid key made on insert, when the row
// was made (and, for rows that change, when it last did), a file kept in file storage, money in
// cents. The columns match the migrations (db/migrations), which stay the schema's history.

/** A row with a uuid key and the time it was made; `initRow` sets up its table. */
export abstract class Row<M extends Model> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  /** Whether the table keeps when a row last changed (its updatedAt column). */
  static readonly keepsUpdatedAt: boolean = false;
  declare id: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
}

/** A row that changes after it is made: it also keeps when it last did. */
export abstract class ChangingRow<M extends Model> extends Row<M> {
  static override readonly keepsUpdatedAt: boolean = true;
  declare updatedAt: CreationOptional<Date>;
}

type RowColumns<M extends Model> = Omit<ModelAttributes<M, Attributes<M>>, "id" | "createdAt" | "updatedAt">;

/**
 * Sets up a Row model on Tenderflow's connection: the uuid key, then `columns`, then the times
 * (updatedAt only for a ChangingRow).
 */
export function initRow<M extends Row<M>>(
  model: ModelStatic<M> & { keepsUpdatedAt: boolean },
  tableName: string,
  columns: RowColumns<M>,
  options: Omit<InitOptions<M>, "sequelize" | "tableName" | "updatedAt"> = {},
) {
  const times = model.keepsUpdatedAt ? { createdAt: DataTypes.DATE, updatedAt: DataTypes.DATE } : { createdAt: DataTypes.DATE };
  const attributes = { id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true }, ...columns, ...times };
  return model.init(attributes as ModelAttributes<M, Attributes<M>>, {
    ...options,
    sequelize,
    tableName,
    ...(model.keepsUpdatedAt ? {} : { updatedAt: false }),
  });
}

interface ColumnOptions {
  /** false unless said: a column may be empty only where the schema allows it */
  allowNull?: boolean;
  unique?: boolean;
  defaultValue?: string | number | boolean;
}

// Each call makes a new definition: Sequelize fills in a column's definition for its model.
const column = (type: DataType, { allowNull = false, ...rest }: ColumnOptions) => ({ type, allowNull, ...rest });

/** A uuid column: most often another row's id. */
export const uuidColumn = (options: ColumnOptions = {}) => column(DataTypes.UUID, options);

/** A text column of at most `length` characters (VARCHAR). */
export const stringColumn = (length: number, options: ColumnOptions = {}) => column(DataTypes.STRING(length), options);

/** A file whose bytes are in file storage (a spec's drawing, an offer's document, a job's file). */
export abstract class StoredFileRow<M extends Model> extends Row<M> {
  declare fileName: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare storageKey: string;
  declare uploadedById: string;
}

/** StoredFileRow's columns; job files' storage key carries no unique constraint (migration 0014). */
export const storedFileColumns = (uniqueKey = true) => ({
  fileName: stringColumn(200),
  contentType: stringColumn(100),
  sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
  storageKey: stringColumn(200, uniqueKey ? { unique: true } : {}),
  uploadedById: uuidColumn(),
});

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
