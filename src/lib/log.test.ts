// A failed query's parameters never reach the log: real PostgreSQL errors, logged through the one error path.
import { afterAll, describe, expect, it, vi } from "vitest";
import { users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { testDb } from "@/test/fixtures";
import { toAppError } from "./errors";
import { queryName } from "./log";

afterAll(async () => {
  await testDb.sql.end();
});

function captureLog() {
  const lines: string[] = [];
  const spy = vi.spyOn(console, "error").mockImplementation((...args: unknown[]) => {
    lines.push(args.map(String).join(" "));
  });
  return { lines, restore: () => spy.mockRestore() };
}

describe("logging a failed query", () => {
  it("writes the error code and the query's name, never the argon2 hash it carried", async () => {
    const passwordHash = await hashPassword("a secret passphrase");
    const error = await testDb.db
      .insert(users)
      .values({ email: `nul-${crypto.randomUUID()}@example.test`, name: "with\u0000nul", passwordHash })
      .then(
        () => null,
        (e: unknown) => e,
      );
    expect(error).not.toBeNull();
    const log = captureLog();
    const appError = toAppError(error);
    log.restore();
    expect(appError.status).toBe(500);
    const text = log.lines.join("\n");
    expect(text).toContain("insert users");
    expect(text).toMatch(/code=22021/);
    expect(text).not.toContain(passwordHash);
    expect(text).not.toMatch(/\$argon2id\$|params:/);
  });

  it("does not quote the value a database message names", async () => {
    const secret = `tok_${crypto.randomUUID()}`;
    const error = await testDb.sql`select ${secret}::uuid`.then(
      () => null,
      (e: unknown) => e,
    );
    const log = captureLog();
    toAppError(error);
    log.restore();
    expect(log.lines.join("\n")).not.toContain(secret);
  });

  it("names queries by operation and table", () => {
    expect(queryName('select "id" from "sessions" where "id" = $1')).toBe("select sessions");
    expect(queryName('update "memberships" set "role" = $1')).toBe("update memberships");
  });
});
