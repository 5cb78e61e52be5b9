import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignOutButton } from "@/components/sign-out-button";
import { listUserWorkspaces } from "@/db/queries/members";
import { getPageSession } from "@/lib/auth/page";
import { AuthHeading } from "../_components/auth-heading";

export const metadata: Metadata = { title: "No workspace" };

export default async function NoWorkspacePage() {
  const session = await getPageSession();
  if (!session) redirect("/sign-in");
  const workspaces = await listUserWorkspaces({ userId: session.user.id });
  if (workspaces.length > 0) redirect("/app");
  return (
    <>
      <AuthHeading title="You are not in a workspace">
        You are signed in as <strong className="font-medium text-ink">{session.user.email}</strong>, but no
        workspace lists you as a member, perhaps because an admin removed you. Everything in Pulsefence lives
        in a workspace, so there is nothing to show yet.
      </AuthHeading>
      <p className="text-sm leading-relaxed text-ink-muted">
        Ask an admin or lead of your team to invite this e-mail address. The link in their e-mail adds the
        workspace to this account.
      </p>
      <div className="mt-5 flex justify-end">
        <SignOutButton variant="primary" />
      </div>
    </>
  );
}
