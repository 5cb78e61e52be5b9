// Any origin of our own would do: the check only compares the target's origin with it.
const base = new URL("http://pulsefence.invalid");

/**
 * A `?next=` target we may send someone to after signing in: a path on this site, nothing else. The target is
 * resolved with the URL parser, as the browser will resolve it (which drops tabs and newlines and reads "\" as
 * "/"), and kept only when it stays on the same origin; the normalised path is returned.
 */
export function safeNext(value: string | string[] | undefined): string | null {
  const next = Array.isArray(value) ? value[0] : value;
  if (!next?.startsWith("/")) return null;
  let url: URL;
  try {
    url = new URL(next, base);
  } catch {
    return null;
  }
  if (url.origin !== base.origin) return null;
  return `${url.pathname}${url.search}${url.hash}`;
}
