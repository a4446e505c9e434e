import path from "node:path";
import { fileURLToPath } from "node:url";
import type { QueryInterface, Sequelize } from "sequelize";
import { SequelizeStorage, Umzug, type MigrationFn } from "umzug";

export type Migration = MigrationFn<QueryInterface>;

const here = path.dirname(fileURLToPath(import.meta.url));

/** Umzug over db/migrations. Migrations are imported from this module so Vitest and tsx both load .ts. */
export function migrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: {
      glob: ["migrations/*.ts", { cwd: here }],
      resolve: ({ name, path: file, context }) => ({
        name,
        up: async () => (await import(file!)).up({ context, name }),
        down: async () => (await import(file!)).down({ context, name }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migrations" }),
    logger: undefined,
  });
}
