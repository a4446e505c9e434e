// `npm run db:migrate` (up) or `tsx db/migrate.ts down`: runs migrations against DATABASE_URL.
import { sequelize } from "~/db.server";
import { migrator } from "./migrator";

const direction = process.argv[2] ?? "up";
const umzug = migrator(sequelize);
const done = direction === "down" ? await umzug.down() : await umzug.up();
console.log(done.length ? `Migrations ${direction}: ${done.map((m) => m.name).join(", ")}` : "Schema is up to date.");
await sequelize.close();
