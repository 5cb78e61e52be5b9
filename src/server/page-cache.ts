import type { IncomingMessage, ServerResponse } from "node:http";
import { LRUCache } from "lru-cache";
import { settledWithin } from "@/lib/time-limit";
import { RENDER_ID_HEADER, renderFailed } from "./render-failures";

// The page memory of one app process (issue: fast under load). A signed-in page is rendered again only when
// something it could show has changed: each rendered page is kept under a key made of the state it was rendered in
// (`version`: the database's, see data-version.ts, where any committed change anywhere gives a new state, and this
// process's memory of who a request is, whose every clearing gives a new one), the whole request that asked for it
// (host, scheme, path and query, every cookie, user agent) and nothing else, for at most a few seconds from the
// start of its render (the clock: "3 minutes ago", a session's expiry). A second identical request in the same state
// gets the same page with a fresh nonce, the only part of a page that must differ per response; the policy header
// and every nonce in the body are swapped.
//
// Only what is safe to replay is kept: full-document GETs with the session cookie (never the router's own requests,
// RSC), answered 200 in HTML, uncompressed, without Set-Cookie, with the content security policy's nonce, by a
// render that reported no error (render-failures.ts: a part streamed after the status can still fail). Requests for
// a key being rendered wait for that render (a few seconds at most) instead of rendering it again. When the state
// cannot be said, nothing is kept or served from memory.
//
// The lean API server keeps its reads the same way (`answers: "reads"`): GETs of /api/ (health excepted) with the
// session cookie or an Authorization header, keyed on that header too, answered 200 in JSON; they carry no nonce.
// Identical reads at the same moment (a dashboard's poll, a bench script's loop) are then answered once.

/** The response header that says how the page was served: "hit", "miss" or "skip". */
export const PAGE_CACHE_HEADER = "x-page-memory";

export type Handler = (req: IncomingMessage, res: ServerResponse) => Promise<void> | void;

export interface PageCacheOptions {
  /**
   * The state a page depends on beyond its request: the database's (equal answers mean nothing was committed between
   * them) and this process's memory of who a request is. Read before the render; null when it cannot be said.
   */
  version: () => Promise<string | null>;
  /** The session cookie's name: a request without it is never kept (anonymous pages, expired sessions). */
  sessionCookie: string;
  /** Nonce for a replayed page (src/lib/nonce.ts). */
  nonce: () => string;
  /** What is kept: the app's pages (the default) or the lean API server's reads. */
  answers?: "pages" | "reads";
  /** Paths never kept (nor waited on): answers known not to be kept, such as files. */
  passes?: (url: string) => boolean;
  /** How long a kept page may be served, ms. */
  ttlMs: number;
  /** Memory bound over all kept pages, bytes. */
  maxBytes: number;
  /** A page larger than this is not kept, bytes. */
  maxPageBytes?: number;
  /** How long an identical request waits for a render in progress before rendering itself, ms. */
  waitMs?: number;
  now?: () => number;
}

interface Entry {
  status: number;
  headers: [string, string | string[]][];
  body: Buffer;
  nonce: string;
  storedAt: number;
}

/** Headers the server sets per response; never replayed. */
const PER_RESPONSE = new Set(["content-length", "transfer-encoding", "date", "connection", "keep-alive"]);
/** Request headers of the router's own requests (RSC payloads, prefetches, server actions). */
const ROUTER_HEADERS = [
  "rsc",
  "next-router-prefetch",
  "next-router-state-tree",
  "next-router-segment-prefetch",
  "next-action",
  "next-url",
];
const NONCE_IN_POLICY = /'nonce-([^']+)'/;

/** What identifies a cacheable request, or null when the request must always be rendered. */
export function requestKey(
  req: IncomingMessage,
  sessionCookie: string,
  answers: "pages" | "reads" = "pages",
): string | null {
  if (req.method !== "GET") return null;
  const url = req.url ?? "";
  const h = req.headers;
  if (answers === "pages") {
    if (!url.startsWith("/") || url.startsWith("/api/") || url.startsWith("/_next/")) return null;
    if (/[?&]_rsc=/.test(url)) return null;
    if (ROUTER_HEADERS.some((name) => h[name] !== undefined)) return null;
  } else if (!url.startsWith("/api/") || /^\/api\/health(?:[/?]|$)/.test(url)) return null;
  const session = h.cookie?.split(";").some((c) => c.trimStart().startsWith(`${sessionCookie}=`));
  if (!session && (answers === "pages" || !h.authorization)) return null;
  // Every header an answer may depend on: who asks, and whether a browser says it asks from another site.
  const parts = [
    h.host,
    h["x-forwarded-proto"],
    url,
    h.cookie,
    h.authorization,
    h.origin,
    h["sec-fetch-site"],
  ];
  parts.push(h["user-agent"]);
  return parts.map((part) => part ?? "").join("\n");
}

/** Replaces every occurrence of `from` in `body` with `to`. */
export function swapNonce(body: Buffer, from: string, to: string): Buffer {
  const needle = Buffer.from(from);
  const parts: Buffer[] = [];
  let start = 0;
  for (let at = body.indexOf(needle); at !== -1; at = body.indexOf(needle, start)) {
    parts.push(body.subarray(start, at), Buffer.from(to));
    start = at + needle.length;
  }
  if (start === 0) return body;
  parts.push(body.subarray(start));
  return Buffer.concat(parts);
}

function headerText(value: string | string[]): string {
  return Array.isArray(value) ? value.join(", ") : value;
}

function toBuffer(chunk: unknown, encoding: unknown): Buffer | null {
  if (typeof chunk === "string")
    return Buffer.from(chunk, typeof encoding === "string" ? (encoding as BufferEncoding) : "utf8");
  if (chunk instanceof Uint8Array) return Buffer.from(chunk);
  return null;
}

/**
 * Watches a response being written and resolves with what may be kept of it once it is finished, or null (not
 * cacheable, too large, or cut short).
 */
function capture(
  res: ServerResponse,
  renderId: string,
  maxPageBytes: number,
  startedAt: number,
  answers: "pages" | "reads",
): Promise<Entry | null> {
  const chunks: Buffer[] = [];
  let size = 0;
  let usable = true;
  let headArgument: Record<string, string | string[] | number> = {};
  const collect = (chunk: unknown, encoding: unknown) => {
    if (!usable || chunk === undefined || chunk === null || typeof chunk === "function") return;
    const buffer = toBuffer(chunk, encoding);
    size += buffer?.length ?? 0;
    if (!buffer || size > maxPageBytes) usable = false;
    else chunks.push(buffer);
  };
  const { write, end, writeHead } = res;
  res.writeHead = function (this: ServerResponse, ...args: unknown[]) {
    const headers = args.find((a, i) => i > 0 && a !== null && typeof a === "object");
    if (Array.isArray(headers)) usable = false;
    else if (headers) headArgument = headers as typeof headArgument;
    return writeHead.apply(this, args as never);
  } as typeof res.writeHead;
  res.write = function (this: ServerResponse, chunk: unknown, ...rest: unknown[]) {
    collect(chunk, rest[0]);
    return write.apply(this, [chunk, ...rest] as never);
  } as typeof res.write;
  res.end = function (this: ServerResponse, chunk?: unknown, ...rest: unknown[]) {
    collect(chunk, rest[0]);
    return end.apply(this, [chunk, ...rest] as never);
  } as typeof res.end;

  return new Promise((resolve) => {
    // The framework reports a failed part through onRequestError a few promise turns after the failure, which may be
    // after the last bytes: the page is judged one turn of the event loop after the response closed.
    res.once("close", () => setImmediate(judge));
    function judge() {
      const failed = renderFailed(renderId);
      if (!res.writableFinished || !usable || failed || res.statusCode !== 200) return resolve(null);
      const headers = new Map<string, string | string[]>();
      for (const [name, value] of Object.entries({ ...res.getHeaders(), ...headArgument })) {
        if (value === undefined) continue;
        headers.set(name.toLowerCase(), typeof value === "number" ? String(value) : value);
      }
      const type = headers.get("content-type");
      const policy = headers.get("content-security-policy");
      // A page carries the policy's nonce, swapped at every replay; a read carries none.
      const nonce = policy ? NONCE_IN_POLICY.exec(headerText(policy))?.[1] : undefined;
      const kind = answers === "pages" ? "text/html" : "application/json";
      if (
        !type ||
        !headerText(type).startsWith(kind) ||
        headers.has("set-cookie") ||
        headers.has("content-encoding") ||
        (answers === "pages" && !nonce)
      )
        return resolve(null);
      resolve({
        status: res.statusCode,
        headers: [...headers].filter(([name]) => !PER_RESPONSE.has(name) && name !== PAGE_CACHE_HEADER),
        body: Buffer.concat(chunks),
        nonce: answers === "pages" ? (nonce ?? "") : "",
        storedAt: startedAt,
      });
    }
  });
}

function replay(entry: Entry, res: ServerResponse, nonce: () => string): void {
  const fresh = entry.nonce ? nonce() : "";
  const swap = (value: string) => (entry.nonce ? value.split(entry.nonce).join(fresh) : value);
  const body = entry.nonce ? swapNonce(entry.body, entry.nonce, fresh) : entry.body;
  res.statusCode = entry.status;
  for (const [name, value] of entry.headers)
    res.setHeader(name, Array.isArray(value) ? value.map(swap) : swap(value));
  res.setHeader("content-length", body.length);
  res.setHeader(PAGE_CACHE_HEADER, "hit");
  res.end(body);
}

/** Wraps the app's request handler with the page memory. */
export function withPageCache(handle: Handler, options: PageCacheOptions): Handler {
  const now = options.now ?? Date.now;
  const maxPageBytes = options.maxPageBytes ?? 2 * 1024 * 1024;
  const entries = new LRUCache<string, Entry>({
    maxSize: options.maxBytes,
    sizeCalculation: (entry, key) => entry.body.length + key.length + 2048,
  });
  const waitMs = options.waitMs ?? 3_000;
  const waitFor = (pending: Promise<Entry | null> | undefined) =>
    pending && settledWithin(pending, waitMs, null);
  const rendering = new Map<string, Promise<Entry | null>>();
  const fresh = (entry: Entry | null | undefined) =>
    entry && now() - entry.storedAt <= options.ttlMs ? entry : null;

  return async (req, res) => {
    delete req.headers[RENDER_ID_HEADER];
    const answers = options.answers ?? "pages";
    const keyed = requestKey(req, options.sessionCookie, answers);
    const request = keyed && options.passes?.(req.url ?? "") ? null : keyed;
    let version: string | null = null;
    if (request) {
      version = await options.version().catch(() => null);
      // The client left while the state was read: there is no one to answer (and a response whose connection
      // closed before it was watched would never report its end). Only reads wait here; a change never does.
      if (res.destroyed) return;
    }
    if (!request || version === null) {
      res.setHeader(PAGE_CACHE_HEADER, "skip");
      return handle(req, res);
    }
    const key = `${version}\n${request}`;
    const kept = fresh(entries.get(key)) ?? fresh(await waitFor(rendering.get(key)));
    if (kept) return replay(kept, res, options.nonce);

    // The client left while it waited for an identical render. (A connection closed before the watch below began
    // would never say so again, and identical requests would wait on it.)
    if (res.destroyed) return;
    res.setHeader(PAGE_CACHE_HEADER, "miss");
    const renderId = crypto.randomUUID();
    req.headers[RENDER_ID_HEADER] = renderId;
    // A page is kept from the moment its render began: every check the render made is at most that old.
    const captured = capture(res, renderId, maxPageBytes, now(), answers);
    if (!rendering.has(key)) rendering.set(key, captured);
    // Kept, and identical requests released, once the response is judged, however the handler itself ends.
    void captured.then((entry) => {
      if (entry) entries.set(key, entry);
      if (rendering.get(key) === captured) rendering.delete(key);
    });
    await handle(req, res);
  };
}
