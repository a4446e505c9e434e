// `npm run db:seed`: loads the demo scenario into an empty database (DATABASE_URL).
import { sequelize } from "~/db.server";
import { seedDemo } from "./seeds/demo";

console.log((await seedDemo(sequelize)) ? "Demo data loaded." : "The database already has data; nothing seeded.");
await sequelize.close();
