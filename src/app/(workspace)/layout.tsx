import Link from "next/link";
import type { ReactNode } from "react";
import { QueryProvider } from "@/components/query-provider";
import { SignOutButton } from "@/components/sign-out-button";
import { Wordmark } from "@/components/wordmark";
import { requireMember } from "@/lib/auth/page";
import { navItemsFor } from "./_components/nav-items";
import { RailNav } from "./_components/rail-nav";
import { TopBarMenu } from "./_components/top-bar-menu";
import { WorkspaceSwitcher } from "./_components/workspace-switcher";

/**
 * The app shell (DESIGN.md): a narrow rail, with the workspace and the account at its foot; the page at right. On a
 * phone or tablet the rail gives way to a bar across the top with a menu (navigation, workspace, account), so that
 * the page keeps the whole width. A skip link leads past the navigation to the page.
 */
/** The workspace switcher, the account link and sign-out: at the rail's foot and in the narrow screens' menu. */
function AccountFooter({ member }: { member: Awaited<ReturnType<typeof requireMember>> }) {
  return (
    <>
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
    </>
  );
}

export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  const member = await requireMember();
  return (
    <QueryProvider>
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded-md focus:bg-panel focus:px-3 focus:py-2 focus:text-sm focus:font-medium focus:shadow"
      >
        Skip to content
      </a>
      <div className="flex min-h-screen flex-col lg:flex-row">
        <header className="relative flex h-14 items-center gap-3 border-b border-line bg-panel px-3 lg:hidden">
          <Link href="/app" aria-label="Pulsefence overview" className="shrink-0 rounded-sm">
            <Wordmark />
          </Link>
          <p className="min-w-0 truncate text-xs text-ink-muted">{member.workspace.name}</p>
          <TopBarMenu>
            <div className="pt-2">
              <RailNav items={navItemsFor(member.can)} touch />
            </div>
            <div className="mt-3 space-y-3 border-t border-line px-3 pt-3">
              <AccountFooter member={member} />
            </div>
          </TopBarMenu>
        </header>
        <div className="hidden w-52 shrink-0 border-r border-line bg-panel lg:block">
          <aside className="sticky top-0 flex h-screen flex-col">
            <div className="flex h-14 items-center px-4">
              <Link href="/app" aria-label="Pulsefence overview" className="rounded-sm">
                <Wordmark />
              </Link>
            </div>
            <RailNav items={navItemsFor(member.can)} />
            <div className="mt-auto space-y-3 border-t border-line px-3 py-3">
              <AccountFooter member={member} />
            </div>
          </aside>
        </div>
        <main
          id="main"
          tabIndex={-1}
          className="min-w-0 flex-1 px-3 py-4 outline-none sm:px-4 lg:px-8 lg:py-6"
        >
          <div className="mx-auto max-w-6xl">{children}</div>
        </main>
      </div>
    </QueryProvider>
  );
}
