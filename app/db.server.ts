import { Sequelize } from "sequelize";
import pg from "pg";
import { env } from "~/env.server";

// One Sequelize instance per process, kept across dev-server reloads so connections don't pile up.
const globalForDb = globalThis as unknown as { __tenderflowDb?: Sequelize };

export const sequelize =
  globalForDb.__tenderflowDb ??
  new Sequelize(env().DATABASE_URL, {
    dialect: "postgres",
    dialectModule: pg,
    logging: env().LOG_SQL === "on" ? (sql: string) => console.log(sql) : false,
    pool: { max: 10, idle: 10_000 },
    define: { underscored: true },
  });

globalForDb.__tenderflowDb = sequelize;
