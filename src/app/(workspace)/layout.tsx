import Link from "next/link";
import type { ReactNode } from "react";
import { QueryProvider } from "@/components/query-provider";
import { SignOutButton } from "@/components/sign-out-button";
import { Wordmark } from "@/components/wordmark";
import { requireMember } from "@/lib/auth/page";
import { navItemsFor } from "./_components/nav-items";
import { RailNav } from "./_components/rail-nav";
import { WorkspaceSwitcher } from "./_components/workspace-switcher";

/**
 * The app shell (DESIGN.md): a narrow rail, with the workspace and the account at its foot; the page at right. On a
 * phone the rail gives way to a bar across the top, so that the page keeps the whole width.
 */
export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  const member = await requireMember();
  return (
    <QueryProvider>
      <div className="flex min-h-screen flex-col md:flex-row">
        <header className="flex items-center gap-3 overflow-x-auto border-b border-line bg-panel px-3 py-2 md:hidden">
          <Link href="/app" aria-label="Pulsefence overview" className="shrink-0 rounded-sm">
            <Wordmark />
          </Link>
          <RailNav items={navItemsFor(member.can)} orientation="horizontal" />
        </header>
        <div className="hidden w-52 shrink-0 border-r border-line bg-panel md:block">
          <aside className="sticky top-0 flex h-screen flex-col">
            <div className="flex h-14 items-center px-4">
              <Link href="/app" aria-label="Pulsefence overview" className="rounded-sm">
                <Wordmark />
              </Link>
            </div>
            <RailNav items={navItemsFor(member.can)} />
            <div className="mt-auto space-y-3 border-t border-line px-3 py-3">
              <WorkspaceSwitcher current={member.workspace.id} workspaces={member.workspaces} />
              <div className="flex items-center justify-between gap-2 border-t border-line px-1 pt-3">
                <Link href="/account" className="group min-w-0" title="Your account">
                  <span className="block truncate text-sm font-medium group-hover:text-accent">
                    {member.user.name}
                  </span>
                  <span className="block truncate text-xs text-ink-faint">{member.user.email}</span>
                </Link>
                <SignOutButton variant="quiet" size="sm" />
              </div>
            </div>
          </aside>
        </div>
        <main className="min-w-0 flex-1 px-4 py-4 md:px-8 md:py-6">
          <div className="mx-auto max-w-6xl">{children}</div>
        </main>
      </div>
    </QueryProvider>
  );
}
