// Renders that reported an error (src/instrumentation.ts, onRequestError), so the page memory (page-cache.ts) does
// not keep a page whose part failed after its first bytes were sent with status 200 (a streamed part's error shows
// in the browser, and must not be sent again from memory). The page memory marks each render it watches with a
// request header; the framework hands that request's headers to onRequestError in the same process. The set lives
// on globalThis because the framework's bundle and the app server load this module each on its own.

/** The request header carrying the watched render's id; a client's own is dropped (page-cache.ts). */
export const RENDER_ID_HEADER = "x-pulsefence-render";
const FAILURES = Symbol.for("pulsefence.render-failures");
/** Failures held at most; beyond, the oldest (of a render no longer watched, in practice) is forgotten first. */
const MAX_HELD = 1_000;

function failures(): Set<string> {
  const holder = globalThis as { [FAILURES]?: Set<string> };
  holder[FAILURES] ??= new Set();
  return holder[FAILURES];
}

/** Notes that the render of the request with these headers reported an error. */
export function noteRenderFailure(headers: NodeJS.Dict<string | string[]>): void {
  const id = headers[RENDER_ID_HEADER];
  if (typeof id !== "string") return;
  const held = failures();
  held.add(id);
  // A set iterates in insertion order: the first is the oldest.
  if (held.size > MAX_HELD) held.delete(held.values().next().value as string);
}

/** Whether the render with this id reported an error; forgets the id. */
export function renderFailed(id: string): boolean {
  return failures().delete(id);
}
