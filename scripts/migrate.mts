// Applies the committed Drizzle migrations in drizzle/ to DATABASE_URL.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { closeDb, db } from "../db/index.ts";

await migrate(db, { migrationsFolder: new URL("../drizzle", import.meta.url).pathname });
await closeDb();
console.log("migrations applied");
