// Seeds the demo workspace of PRODUCT.md's scenario, idempotently: running it again changes nothing.
// `--print-sign-in` prints the demo sign-in lines for the start command instead.
import { createDb } from "../src/db/client";
import { workspaces } from "../src/db/schema";

export const demoWorkspace = { name: "Tidewater Power Lab", slug: "tidewater-power-lab" };

if (process.argv.includes("--print-sign-in")) {
  console.log(`    demo      workspace "${demoWorkspace.name}"`);
  process.exit(0);
}

const url = process.env.DATABASE_URL;
if (!url) {
  console.error("DATABASE_URL is missing");
  process.exit(1);
}
const { db, sql } = createDb(url, { max: 1 });
try {
  await db.insert(workspaces).values(demoWorkspace).onConflictDoNothing({ target: workspaces.slug });
} finally {
  await sql.end();
}
