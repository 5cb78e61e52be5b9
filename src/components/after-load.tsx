"use client";

import { type ReactNode, useEffect, useState } from "react";

/**
 * Whether the page has finished loading: true from the first render after the window's `load` event. Parts of a
 * page below its first screen wait for it, so their code loads after the page is drawn and usable, not with it.
 */
export function useAfterLoad(): boolean {
  const [loaded, setLoaded] = useState(false);
  useEffect(() => {
    if (document.readyState === "complete") {
      setLoaded(true);
      return;
    }
    const done = () => setLoaded(true);
    window.addEventListener("load", done, { once: true });
    return () => window.removeEventListener("load", done);
  }, []);
  return loaded;
}

/** Renders `children` once the page has loaded (see `useAfterLoad`), and `fallback` until then. */
export function AfterLoad({ children, fallback }: { children: ReactNode; fallback: ReactNode }) {
  return useAfterLoad() ? children : fallback;
}
