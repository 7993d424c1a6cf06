// Seeds the demo scenario into DATABASE_URL. Safe to run again: it leaves the same rows.
import { closeDb, db } from "../db/index.ts";
import { seedDemo } from "./seed/demo.ts";

await seedDemo(db);
await closeDb();
console.log("demo scenario seeded");
