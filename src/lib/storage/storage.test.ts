import { createHash, randomBytes } from "node:crypto";
import { Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { storageConfig } from "@/test/services";
import { createStorage } from "./storage";

const config = storageConfig();
const storage = createStorage(config);
const sha = (b: Uint8Array) => createHash("sha256").update(b).digest("hex");

describe("object storage (S3 SDK against the local fake)", () => {
  it("puts and gets an object", async () => {
    const key = `test/${crypto.randomUUID()}.csv`;
    const text = "width,V_DS [V],I_D [A]\n1 ms,10,40\n";
    await storage.put(key, text, { contentType: "text/csv" });
    expect((await storage.get(key))?.toString("utf8")).toBe(text);
    expect(await storage.head(key)).toMatchObject({ size: Buffer.byteLength(text), contentType: "text/csv" });
    await storage.remove(key);
    expect(await storage.get(key)).toBeNull();
  });

  it("returns a streamed body byte-identical (no chunk framing stored)", async () => {
    const key = `test/${crypto.randomUUID()}.bin`;
    const bytes = randomBytes(3 * 1024 * 1024 + 17);
    const chunks = Array.from({ length: 7 }, (_, k) =>
      bytes.subarray((k * bytes.length) / 7, ((k + 1) * bytes.length) / 7),
    );
    await storage.put(key, Readable.from(chunks), { contentLength: bytes.length });
    const back = await storage.get(key);
    expect(back?.length).toBe(bytes.length);
    expect(sha(back!)).toBe(sha(bytes));
    await storage.remove(key);
  });

  it("lets a browser-style client PUT through a presigned URL", async () => {
    const key = `test/${crypto.randomUUID()}.csv`;
    const url = await storage.presignPut(key, { contentType: "text/csv" });
    const res = await fetch(url, {
      method: "PUT",
      body: "a,b\n1,2\n",
      headers: { "content-type": "text/csv" },
    });
    expect(res.status).toBe(200);
    expect((await storage.get(key))?.toString()).toBe("a,b\n1,2\n");
    await storage.remove(key);
  });

  it("answers a clear 503 error when the store is unreachable", async () => {
    const down = createStorage({ ...config, endpoint: "http://127.0.0.1:9" });
    const error = await down.ping().catch((e: unknown) => e);
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).status).toBe(503);
    expect((error as AppError).code).toBe("unavailable:storage");
  });
});
