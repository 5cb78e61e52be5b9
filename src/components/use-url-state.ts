"use client";

import { usePathname, useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";

// The one way a page keeps its view in the URL (the library's filters and page, the open capture, the
// comparison's columns and filters): read the search parameters, change some of them in place.

/** Parameters to change: a value sets one, `null` removes it. */
export type UrlChange = Record<string, string | null>;

/** The search string after a change: either some parameters changed, or the whole set replaced. */
export function nextSearch(current: string, change: UrlChange | URLSearchParams): string {
  if (change instanceof URLSearchParams) return change.toString();
  const next = new URLSearchParams(current);
  for (const [key, value] of Object.entries(change)) {
    if (value === null) next.delete(key);
    else next.set(key, value);
  }
  return next.toString();
}

/** The address for a path and a search string, without a bare "?" when there is nothing to search. */
export function urlOf(pathname: string, search: string): string {
  return search ? `${pathname}?${search}` : pathname;
}

export interface UrlStateOptions {
  /** A new history entry (Back returns to the previous view) rather than replacing the current one. */
  push?: boolean;
}

/**
 * The page's search parameters and a setter that changes them in place (no navigation, no server round trip).
 * The new value is kept at once in local state, so a controlled checkbox never flips back while Next.js
 * catches `useSearchParams` up with `history.replaceState`; a change of the URL from elsewhere is taken over.
 */
export function useUrlState() {
  const params = useSearchParams();
  const pathname = usePathname();
  const fromUrl = params.toString();
  const [seen, setSeen] = useState(fromUrl);
  const [search, setSearch] = useState(fromUrl);
  if (fromUrl !== seen) {
    setSeen(fromUrl);
    setSearch(fromUrl);
  }
  const current = useMemo(() => new URLSearchParams(search), [search]);
  const set = useCallback(
    (change: UrlChange | URLSearchParams, options: UrlStateOptions = {}) => {
      const text = nextSearch(search, change);
      setSearch(text);
      const url = urlOf(pathname, text);
      if (options.push) window.history.pushState(null, "", url);
      else window.history.replaceState(null, "", url);
    },
    [search, pathname],
  );
  return [current, set] as const;
}
