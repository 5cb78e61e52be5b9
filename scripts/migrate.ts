// Applies the migrations in drizzle/ to DATABASE_URL. Run by the start and test commands.
import { migrate } from "drizzle-orm/postgres-js/migrator";
import { createDb } from "../src/db/client";

const url = process.env.DATABASE_URL;
if (!url) {
  console.error("DATABASE_URL is missing");
  process.exit(1);
}
const { db, sql } = createDb(url, { max: 1 });
try {
  await migrate(db, { migrationsFolder: "drizzle" });
} finally {
  await sql.end();
}
