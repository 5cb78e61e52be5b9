"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ReactNode } from "react";
import type { NavIcon, NavItem } from "./nav-items";

const icons: Record<NavIcon, ReactNode> = {
  overview: (
    <>
      <rect x="2.5" y="2.5" width="4.5" height="4.5" />
      <rect x="9" y="2.5" width="4.5" height="4.5" />
      <rect x="2.5" y="9" width="4.5" height="4.5" />
      <path d="M9 13.5h4.5M9 11.25h4.5M9 9h4.5" />
    </>
  ),
  library: (
    <>
      <path d="M2.5 13.5V2.5M2.5 4.5h4.5l6.5 6.5" />
      <path d="M2.5 13.5h11" />
    </>
  ),
  projects: (
    <>
      <rect x="2.5" y="3" width="11" height="10" rx="1" />
      <path d="M2.5 6h11M5 8.5l1.5 1.5L9 7.5" />
    </>
  ),
  team: (
    <>
      <circle cx="6" cy="5.5" r="2.25" />
      <path d="M2 13.5c.4-2.3 2-3.5 4-3.5s3.6 1.2 4 3.5" />
      <circle cx="11.5" cy="6" r="1.75" />
      <path d="M11 9.6c1.7 0 2.8 1 3.1 2.9" />
    </>
  ),
  account: (
    <>
      <circle cx="8" cy="5.5" r="2.5" />
      <path d="M3.5 14c.5-2.6 2.3-4 4.5-4s4 1.4 4.5 4" />
    </>
  ),
};

export function RailNav({
  items,
  touch = false,
}: {
  items: NavItem[];
  /** In the narrow-screen menu: rows a thumb can hit (44 px). */
  touch?: boolean;
}) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main" className="px-2">
      <ul className="space-y-0.5">
        {items.map((item) => {
          const current = pathname === item.href || pathname.startsWith(`${item.href}/`);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                aria-current={current ? "page" : undefined}
                className={`flex items-center gap-2.5 rounded-md px-2.5 text-sm ${touch ? "h-11" : "h-8"} ${
                  current
                    ? "bg-accent-soft font-medium text-accent-strong"
                    : "text-ink-muted hover:bg-sunken hover:text-ink"
                }`}
              >
                <svg
                  width="16"
                  height="16"
                  viewBox="0 0 16 16"
                  aria-hidden="true"
                  fill="none"
                  stroke="currentColor"
                  strokeWidth="1.3"
                  className="shrink-0"
                >
                  {icons[item.icon]}
                </svg>
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
