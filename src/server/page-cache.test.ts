// The page memory (page-cache.ts) over real HTTP, with a stand-in for the framework's handler that counts its
// renders. The database state it keys on is tested in data-version.test.ts.
import { createServer, type IncomingMessage, request, type Server, type ServerResponse } from "node:http";
import type { AddressInfo } from "node:net";
import { gzipSync } from "node:zlib";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { freshNonce } from "@/lib/nonce";
import { type Handler, PAGE_CACHE_HEADER, requestKey, swapNonce, withPageCache } from "./page-cache";
import { noteRenderFailure, RENDER_ID_HEADER } from "./render-failures";

interface Stage {
  renders: number;
  version: string;
  clock: number;
  /** When set, the state read waits for it; `reads` counts the reads begun. */
  gate?: Promise<void>;
  reads: number;
  /** What the stand-in answers; by default a 200 HTML page carrying its nonce in the policy and body. */
  answer: (req: IncomingMessage, res: ServerResponse, nonce: string) => Promise<void> | void;
}

const page = (nonce: string, text: string) =>
  `<html><body><script nonce="${nonce}">1</script><p>${text}</p><script nonce="${nonce}">2</script></body></html>`;

const htmlAnswer: Stage["answer"] = (req, res, nonce) => {
  res.setHeader("content-security-policy", `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'`);
  res.setHeader("content-type", "text/html; charset=utf-8");
  res.setHeader("vary", "rsc");
  // Written in pieces, as a streamed render is.
  res.write(page(nonce, `render for ${req.url}`).slice(0, 20));
  res.end(page(nonce, `render for ${req.url}`).slice(20));
};

let stage: Stage;
let server: Server;
let origin: string;

beforeEach(async () => {
  stage = { renders: 0, version: "1:1:", clock: 0, answer: htmlAnswer, reads: 0 };
  const handler: Handler = async (req, res) => {
    stage.renders++;
    await stage.answer(req, res, freshNonce());
  };
  server = createServer(
    withPageCache(handler, {
      version: async () => {
        stage.reads++;
        await stage.gate;
        return stage.version === "down" ? null : stage.version;
      },
      sessionCookie: "pf_session",
      nonce: freshNonce,
      ttlMs: 5_000,
      waitMs: 1_000,
      maxBytes: 1024 * 1024,
      maxPageBytes: 64 * 1024,
      now: () => stage.clock,
    }),
  );
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterEach(() => new Promise((resolve) => server.close(resolve)));

const openConnections = () =>
  new Promise<number>((resolve, reject) =>
    server.getConnections((error, count) => (error ? reject(error) : resolve(count))),
  );

async function get(path: string, headers: Record<string, string> = { cookie: "pf_session=a" }) {
  const res = await fetch(`${origin}${path}`, { headers, redirect: "manual" });
  const body = await res.text();
  const nonce = /'nonce-([^']+)'/.exec(res.headers.get("content-security-policy") ?? "")?.[1] ?? "";
  return { res, body, nonce, served: res.headers.get(PAGE_CACHE_HEADER) };
}

describe("page memory", () => {
  it("sends a page asked again in the same database state without rendering it, with a fresh nonce", async () => {
    const first = await get("/projects/1");
    const second = await get("/projects/1");
    expect([first.served, second.served, stage.renders]).toEqual(["miss", "hit", 1]);
    expect(second.res.status).toBe(200);
    expect(second.nonce).toMatch(/^[A-Za-z0-9+/]{48}$/);
    expect(second.nonce).not.toBe(first.nonce);
    // The same page, nonce for nonce; the old nonce is nowhere in it.
    expect(second.body).toBe(first.body.split(first.nonce).join(second.nonce));
    expect(second.body).not.toContain(first.nonce);
    expect(second.body.split(second.nonce)).toHaveLength(3);
    expect(second.res.headers.get("content-type")).toBe("text/html; charset=utf-8");
    expect(second.res.headers.get("vary")).toBe("rsc");
    expect(Number(second.res.headers.get("content-length"))).toBe(Buffer.byteLength(second.body));
  });

  it("renders again once anything was committed, and after the time a page is kept", async () => {
    await get("/app");
    stage.version = "1:2:";
    expect((await get("/app")).served).toBe("miss");
    expect((await get("/app")).served).toBe("hit");
    stage.clock += 5_001;
    expect((await get("/app")).served).toBe("miss");
    expect(stage.renders).toBe(3);
  });

  it("keeps each request apart: path, query, cookie, user agent, scheme", async () => {
    await get("/app");
    await get("/app?tab=2");
    await get("/app", { cookie: "pf_session=b" });
    await get("/app", { cookie: "pf_session=a", "user-agent": "another browser" });
    await get("/app", { cookie: "pf_session=a", "x-forwarded-proto": "https" });
    expect(stage.renders).toBe(5);
    expect((await get("/app?tab=2")).body).toContain("render for /app?tab=2");
  });

  it("always renders what is not a signed-in document request", async () => {
    const always: [string, Record<string, string>][] = [
      ["/app", {}], // no cookie: anonymous
      ["/app", { cookie: "theme=dark; pf_sessionx=1" }], // cookies, but no session
      ["/app", { cookie: "pf_session=a", rsc: "1" }], // the router's own request
      ["/app", { cookie: "pf_session=a", "next-router-prefetch": "1" }],
      ["/app?_rsc=abc", { cookie: "pf_session=a" }],
      ["/api/projects", { cookie: "pf_session=a" }],
    ];
    for (const [path, headers] of always) {
      await get(path, headers);
      expect((await get(path, headers)).served).toBe("skip");
    }
    expect(stage.renders).toBe(always.length * 2);
    const post = await fetch(`${origin}/app`, { method: "POST", headers: { cookie: "pf_session=a" } });
    await post.text();
    expect(post.headers.get(PAGE_CACHE_HEADER)).toBe("skip");
  });

  it("keeps no answer that is not a plain 200 HTML page with its nonce", async () => {
    const answers: Stage["answer"][] = [
      (_req, res) => {
        res.statusCode = 307;
        res.setHeader("location", "/sign-in");
        res.end();
      },
      (req, res, nonce) => {
        res.setHeader("set-cookie", "pf_session=renewed");
        htmlAnswer(req, res, nonce);
      },
      (_req, res, nonce) => {
        res.setHeader("content-security-policy", `script-src 'nonce-${nonce}'`);
        res.setHeader("content-type", "text/html");
        res.setHeader("content-encoding", "gzip");
        res.end(gzipSync(page(nonce, "compressed")));
      },
      (_req, res) => {
        res.setHeader("content-type", "text/html");
        res.end("<p>no policy, no nonce</p>");
      },
      (_req, res) => {
        res.writeHead(200, { "content-type": "application/json" });
        res.end("{}");
      },
      (req, res, nonce) => {
        res.statusCode = 404;
        htmlAnswer(req, res, nonce);
      },
      // A part streamed after the status failed, as the framework reports through onRequestError.
      (req, res, nonce) => {
        res.setHeader("content-security-policy", `script-src 'nonce-${nonce}'`);
        res.setHeader("content-type", "text/html");
        res.write(page(nonce, "shell sent"));
        noteRenderFailure(req.headers);
        res.end("<p>a part failed</p>");
      },
      // Larger than a page may be.
      (_req, res, nonce) => {
        res.setHeader("content-security-policy", `script-src 'nonce-${nonce}'`);
        res.setHeader("content-type", "text/html");
        res.end("x".repeat(65 * 1024));
      },
    ];
    for (const answer of answers) {
      stage.answer = answer;
      stage.renders = 0;
      stage.version = crypto.randomUUID();
      await get("/app");
      expect((await get("/app")).served).toBe("miss");
      expect(stage.renders).toBe(2);
    }
  });

  it("reads headers given to writeHead as well as those set before", async () => {
    stage.answer = (_req, res, nonce) => {
      res.setHeader("x-before", "1");
      res.writeHead(200, {
        "content-type": "text/html",
        "content-security-policy": `script-src 'nonce-${nonce}'`,
      });
      res.end(page(nonce, "written at once"));
    };
    await get("/app");
    const second = await get("/app");
    expect(second.served).toBe("hit");
    expect(second.res.headers.get("x-before")).toBe("1");
    expect(second.body).toBe(page(second.nonce, "written at once"));
  });

  it("renders once for identical requests that arrive together; every one gets its own nonce", async () => {
    stage.answer = async (req, res, nonce) => {
      await new Promise((r) => setTimeout(r, 50));
      htmlAnswer(req, res, nonce);
    };
    const answers = await Promise.all(Array.from({ length: 12 }, () => get("/projects/1/compare")));
    expect(stage.renders).toBe(1);
    expect(answers.filter((a) => a.served === "hit")).toHaveLength(11);
    expect(new Set(answers.map((a) => a.nonce)).size).toBe(12);
    for (const a of answers) expect(a.body).toBe(page(a.nonce, "render for /projects/1/compare"));
  });

  it("marks the renders it watches itself: a client cannot mark another's render as failed", async () => {
    const seen: (string | string[] | undefined)[] = [];
    stage.answer = (req, res, nonce) => {
      seen.push(req.headers[RENDER_ID_HEADER]);
      htmlAnswer(req, res, nonce);
    };
    await get("/app", { cookie: "pf_session=a", [RENDER_ID_HEADER]: "chosen-by-client" });
    await get("/app", { cookie: "pf_session=b", [RENDER_ID_HEADER]: "chosen-by-client" });
    await get("/api/projects", { cookie: "pf_session=a", [RENDER_ID_HEADER]: "chosen-by-client" });
    expect(seen[0]).toMatch(/^[0-9a-f-]{36}$/);
    expect(seen[1]).toMatch(/^[0-9a-f-]{36}$/);
    expect(seen[0]).not.toBe(seen[1]);
    expect(seen[2]).toBeUndefined();
  });

  it("waits for a render in progress a bounded time, then renders itself", async () => {
    stage.answer = async (req, res, nonce) => {
      await new Promise((r) => setTimeout(r, stage.renders === 1 ? 1_500 : 0));
      htmlAnswer(req, res, nonce);
    };
    const slow = get("/slow");
    await new Promise((r) => setTimeout(r, 100));
    const waited = await get("/slow");
    expect(waited.served).toBe("miss");
    expect((await slow).served).toBe("miss");
    expect(stage.renders).toBe(2);
  });

  it("renders nothing for a client that left while the state was read, and holds no one up after it", async () => {
    let release = () => {};
    stage.gate = new Promise((resolve) => (release = resolve));
    const leaving = request(`${origin}/app`, { headers: { cookie: "pf_session=a" } });
    leaving.on("error", () => {});
    leaving.end();
    await vi.waitFor(() => expect(stage.reads).toBe(1));
    leaving.destroy();
    await vi.waitFor(async () => expect(await openConnections()).toBe(0));
    release();
    stage.gate = undefined;
    // Had it been rendered, watched after its connection closed, identical requests would wait on it in vain.
    const [first, second] = [await get("/app"), await get("/app")];
    expect([first.served, second.served, stage.renders]).toEqual(["miss", "hit", 1]);
  });

  it("renders every request when the database cannot say its state", async () => {
    stage.version = "down";
    await get("/app");
    expect((await get("/app")).served).toBe("skip");
    expect(stage.renders).toBe(2);
  });
});

describe("requestKey and swapNonce", () => {
  it("keys a request by host, scheme, path, cookie, credentials, origin and user agent", () => {
    const req = {
      method: "GET",
      url: "/library/7?x=1",
      headers: { cookie: "c=1", host: "h", "x-forwarded-proto": "https", "user-agent": "u" },
    } as unknown as IncomingMessage;
    // Empty places: no Authorization, Origin or Sec-Fetch-Site header.
    expect(requestKey(req, "c")).toBe("h\nhttps\n/library/7?x=1\nc=1\n\n\n\nu");
    expect(requestKey(req, "session")).toBeNull();
  });

  it("swaps every occurrence, at the edges too, and leaves a body without it as it is", () => {
    const body = Buffer.from("NNa NN bNN");
    expect(swapNonce(body, "NN", "MMM").toString()).toBe("MMMa MMM bMMM");
    const none = Buffer.from("nothing here");
    expect(swapNonce(none, "NN", "M")).toBe(none);
  });
});
