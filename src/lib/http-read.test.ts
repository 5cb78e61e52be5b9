// readJson decodes the body chunk by chunk: a character split between two chunks must still arrive whole. A body
// of declared length is read whole, within the same bound.
import { describe, expect, it } from "vitest";
import { readJson } from "./http";

function streamed(chunks: Uint8Array[], headers: Record<string, string> = {}): Request {
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      for (const chunk of chunks) controller.enqueue(chunk);
      controller.close();
    },
  });
  return new Request("http://127.0.0.1/api/test", {
    method: "POST",
    body,
    headers,
    duplex: "half",
  } as RequestInit);
}

describe("readJson", () => {
  it("joins a multi-byte character split between chunks", async () => {
    const bytes = new TextEncoder().encode(JSON.stringify({ name: "Ωmega °C é" }));
    const cut = bytes.indexOf(0xce) + 1; // inside the two bytes of Ω
    expect(await readJson(streamed([bytes.slice(0, cut), bytes.slice(cut)]))).toEqual({ name: "Ωmega °C é" });
  });

  it("still refuses a body larger than its bound while streaming", async () => {
    const chunk = new TextEncoder().encode(`"${"x".repeat(1000)}"`);
    await expect(readJson(streamed([chunk, chunk]), { maxBytes: 1500 })).rejects.toMatchObject({
      code: "too_large:body",
    });
  });

  it("reads a body of declared length whole, the same text", async () => {
    const bytes = new TextEncoder().encode(JSON.stringify({ name: "Ωmega °C é" }));
    const cut = bytes.indexOf(0xce) + 1;
    const declared = { "content-length": String(bytes.length) };
    expect(await readJson(streamed([bytes.slice(0, cut), bytes.slice(cut)], declared))).toEqual({
      name: "Ωmega °C é",
    });
  });

  it("refuses a body longer than its bound even when its declared length was within it", async () => {
    const chunk = new TextEncoder().encode(`"${"x".repeat(1000)}"`);
    const request = streamed([chunk, chunk], { "content-length": "100" });
    await expect(readJson(request, { maxBytes: 1500 })).rejects.toMatchObject({ code: "too_large:body" });
  });
});
