"use client";

import { usePathname } from "next/navigation";
import { type ReactNode, useEffect, useState } from "react";

/**
 * The narrow-screen menu: a button in the top bar that opens the navigation, the workspace switcher and the
 * account under it. It closes when a page is chosen and on Escape.
 */
export function TopBarMenu({ children }: { children: ReactNode }) {
  const [open, setOpen] = useState(false);
  const pathname = usePathname();
  // biome-ignore lint/correctness/useExhaustiveDependencies: a new page closes the menu.
  useEffect(() => setOpen(false), [pathname]);
  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") setOpen(false);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [open]);

  return (
    <>
      <button
        type="button"
        aria-expanded={open}
        aria-controls="top-bar-menu"
        onClick={() => setOpen((o) => !o)}
        className="ml-auto inline-flex h-11 min-w-11 items-center justify-center gap-2 rounded-md border border-line px-3 text-sm font-medium text-ink hover:bg-sunken"
      >
        <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true" fill="none" stroke="currentColor">
          {open ? (
            <path d="M3.5 3.5l9 9M12.5 3.5l-9 9" strokeWidth="1.4" />
          ) : (
            <path d="M2.5 4h11M2.5 8h11M2.5 12h11" strokeWidth="1.4" />
          )}
        </svg>
        Menu
      </button>
      {open ? (
        <div
          id="top-bar-menu"
          className="absolute inset-x-0 top-full z-30 max-h-[calc(100vh-3.5rem)] overflow-y-auto border-b border-line bg-panel pb-3 shadow-lg"
        >
          {children}
        </div>
      ) : null}
    </>
  );
}
