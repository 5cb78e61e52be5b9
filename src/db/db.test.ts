import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { requireEnv } from "@/test/services";
import { createDb } from "./client";
import { workspaces } from "./schema";

const { db, sql } = createDb(requireEnv("DATABASE_URL"), { max: 2 });
afterAll(() => sql.end());

describe("database (real PostgreSQL)", () => {
  it("writes a workspace through Drizzle and reads it back", async () => {
    const slug = `it-${crypto.randomUUID()}`;
    const [created] = await db.insert(workspaces).values({ name: "Integration bench", slug }).returning();
    const [read] = await db.select().from(workspaces).where(eq(workspaces.slug, slug));
    expect(read).toEqual(created);
    expect(read.name).toBe("Integration bench");
    expect(read.createdAt).toBeInstanceOf(Date);
    await db.delete(workspaces).where(eq(workspaces.id, created.id));
  });

  it("refuses a second workspace with the same slug", async () => {
    const slug = `it-${crypto.randomUUID()}`;
    await db.insert(workspaces).values({ name: "A", slug });
    await expect(db.insert(workspaces).values({ name: "B", slug })).rejects.toThrow();
    await db.delete(workspaces).where(eq(workspaces.slug, slug));
  });

  it("holds the seeded demo workspace", async () => {
    const [demo] = await db.select().from(workspaces).where(eq(workspaces.slug, "tidewater-power-lab"));
    expect(demo?.name).toBe("Tidewater Power Lab");
  });
});
