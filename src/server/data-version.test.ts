// The database state the page memory keys on (data-version.ts), against the real PostgreSQL: equal between
// reads, another after every commit or rollback of a transaction that wrote.
import { afterAll, describe, expect, it } from "vitest";
import { createDb } from "@/db/client";
import { requireEnv } from "@/test/services";
import { snapshotVersion } from "./data-version";

describe("database state (real PostgreSQL)", () => {
  const url = requireEnv("DATABASE_URL");
  const state = snapshotVersion(url);
  const { sql } = createDb(url, { max: 3 });
  afterAll(async () => {
    await state.end();
    await sql.end();
  });

  /**
   * The state, read until two reads in a row agree (at most 10 times): transaction ids are the whole server's, so
   * a write in another database of it (the browser tests' app, say) between two reads is rightly a new state.
   */
  async function steadyState(): Promise<string | null> {
    for (let attempt = 0; attempt < 10; attempt++) {
      const first = await state.version();
      if ((await state.version()) === first) return first;
    }
    return null;
  }

  /** A connection of its own with a temporary table to write to: a write like any other, seen by no one else. */
  async function writer() {
    const connection = await sql.reserve();
    await connection`create temporary table if not exists state_probe (n int)`;
    return connection;
  }

  it("stays the same over reads and moves with every commit, seen from the first commit on", async () => {
    const connection = await writer();
    try {
      // Reads in between change nothing.
      const before = await steadyState();
      expect(before).not.toBeNull();
      // A transaction that writes: while it is open, pages rendered see the old data; once committed, the state
      // is another, so nothing rendered before is sent again.
      await connection`begin`;
      await connection`insert into state_probe values (1)`;
      const during = await state.version();
      await connection`commit`;
      const after = await state.version();
      expect(after).not.toBe(during);
      expect(after).not.toBe(before);
      // A write rolled back moves it too (pages rendered again for nothing, never one missed).
      await connection`begin`;
      await connection`insert into state_probe values (2)`;
      await connection`rollback`;
      expect(await state.version()).not.toBe(after);
    } finally {
      connection.release();
    }
  });

  it("moves when a transaction commits that was running when the state was read", async () => {
    const connection = await writer();
    try {
      await connection`begin`;
      await connection`insert into state_probe values (3)`;
      const running = await steadyState();
      expect(running).not.toBeNull();
      await connection`commit`;
      expect(await state.version()).not.toBe(running);
    } finally {
      connection.release();
    }
  });
});
