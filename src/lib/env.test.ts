import { describe, expect, it } from "vitest";
import { EnvError, parseEnv } from "./env";

const good = {
  DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db",
  S3_ENDPOINT: "http://127.0.0.1:9000",
  S3_BUCKET: "pulsefence",
  S3_ACCESS_KEY_ID: "k",
  S3_SECRET_ACCESS_KEY: "s",
  SMTP_HOST: "127.0.0.1",
  SMTP_PORT: "1025",
};

describe("parseEnv", () => {
  it("accepts a complete environment and applies defaults", () => {
    const env = parseEnv(good);
    expect(env.SMTP_PORT).toBe(1025);
    expect(env.SMTP_SECURE).toBe(false);
    expect(env.APP_URL).toBe("http://127.0.0.1:3000");
  });

  it("names a missing variable", () => {
    const { DATABASE_URL: _, ...rest } = good;
    expect(() => parseEnv(rest)).toThrow(/DATABASE_URL is missing/);
  });

  it("names a malformed variable", () => {
    const error = (() => {
      try {
        parseEnv({ ...good, SMTP_PORT: "seventy" });
      } catch (e) {
        return e;
      }
    })();
    expect(error).toBeInstanceOf(EnvError);
    expect((error as EnvError).problems).toEqual([expect.stringMatching(/^SMTP_PORT is malformed/)]);
  });
});
