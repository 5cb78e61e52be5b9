"use client";

import { usePathname, useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";

/**
 * The page's search parameters and a setter that changes some of them in place (no navigation, no server
 * round trip): `null` removes a parameter. The new value is kept at once in local state, so a controlled
 * checkbox never flips back while Next.js catches `useSearchParams` up with `history.replaceState`; a change of
 * the URL from elsewhere is taken over.
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
    (change: Record<string, string | null>) => {
      const next = new URLSearchParams(current);
      for (const [key, value] of Object.entries(change)) {
        if (value === null) next.delete(key);
        else next.set(key, value);
      }
      const text = next.toString();
      setSearch(text);
      window.history.replaceState(null, "", text ? `${pathname}?${text}` : pathname);
    },
    [current, pathname],
  );
  return [current, set] as const;
}
