import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/page-header";
import { actionDescriptions } from "@/components/role-text";
import { rememberedMembers } from "@/lib/auth/auth-memory";
import { requireMember } from "@/lib/auth/page";
import {
  type Action,
  actions,
  can,
  grantedByLeadRights,
  roleLabels,
  rolesAllowed,
} from "@/lib/auth/permissions";

export const metadata: Metadata = { title: "Not for your role" };

/**
 * Where a page the caller's role may not open sends them (src/lib/auth/page.ts): which role may, and whom to ask.
 * It names only the workspace's admins, whom every member may already see on the overview.
 */
export default async function NotAllowedPage({
  searchParams,
}: {
  searchParams: Promise<{ action?: string; from?: string }>;
}) {
  const member = await requireMember();
  const { action: raw } = await searchParams;
  const action = (actions as readonly string[]).includes(raw ?? "") ? (raw as Action) : null;
  const admins = (await rememberedMembers(member.workspace.id)).filter((m) => can(m.role, "member.manage"));
  const allowed = action ? rolesAllowed(action).map((r) => roleLabels[r].toLowerCase()) : [];
  const byLeadRights = action ? grantedByLeadRights(action) : false;

  return (
    <div className="max-w-2xl space-y-6">
      <PageHeader title="Not for your role" context={member.workspace.name} />
      <div className="space-y-3 text-sm" data-testid="not-allowed">
        <p>
          You are signed in as <span className="font-medium">{roleLabels[member.role].toLowerCase()}</span> in{" "}
          {member.workspace.name}
          {action ? (
            <>
              , and this page is for members who may{" "}
              <span className="font-medium">{actionDescriptions[action].toLowerCase()}</span>
            </>
          ) : null}
          .
        </p>
        {action ? (
          <p>
            It opens for the roles: <span className="font-medium">{allowed.join(", ")}</span>
            {byLeadRights ? ", and for any member an admin has given lead rights" : ""}.
          </p>
        ) : null}
        <p>
          To get access, ask an admin of this workspace to change your role
          {byLeadRights ? " or grant you lead rights" : ""}:{" "}
          {admins.length > 0
            ? admins.map((a, i) => (
                <span key={a.userId}>
                  {i > 0 ? ", " : ""}
                  <span className="font-medium">{a.name}</span> (
                  <a className="text-accent underline underline-offset-2" href={`mailto:${a.email}`}>
                    {a.email}
                  </a>
                  )
                </span>
              ))
            : "no admin is listed"}
          .
        </p>
        <p>
          <Link href="/app" className="text-accent underline underline-offset-2">
            Back to the overview
          </Link>
        </p>
      </div>
    </div>
  );
}
