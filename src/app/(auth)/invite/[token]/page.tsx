import type { Metadata } from "next";
import Link from "next/link";
import { DateText } from "@/components/date-text";
import { roleSummaries } from "@/components/role-text";
import { findUserByEmail } from "@/db/queries/members";
import { findOpenInvitation } from "@/lib/auth/accounts";
import { roleLabels } from "@/lib/auth/permissions";
import { AuthFooter, AuthHeading, linkClass } from "../../_components/auth-heading";
import { AcceptInvitationForm } from "./accept-invitation-form";

export const metadata: Metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await findOpenInvitation(token);
  if (!invitation) {
    return (
      <>
        <AuthHeading eyebrow="Invitation" title="This invitation link cannot be used">
          It has already been used, was revoked, or is more than 7 days old. Ask the person who invited you to
          send a new one from their Team page.
        </AuthHeading>
        <AuthFooter>
          Already accepted it?{" "}
          <Link href="/sign-in" className={linkClass}>
            Sign in
          </Link>
        </AuthFooter>
      </>
    );
  }
  const existing = Boolean(await findUserByEmail(invitation.email));
  return (
    <>
      <AuthHeading eyebrow="Invitation" title={`Join ${invitation.workspaceName}`}>
        {existing
          ? "You already have a Pulsefence account with this e-mail. Enter its password to add this workspace to it."
          : "Create your Pulsefence account to accept."}
      </AuthHeading>
      <dl className="mb-5 grid grid-cols-[6rem_1fr] gap-x-3 gap-y-1.5 rounded-md border border-line bg-sunken px-3 py-2.5 text-sm">
        <dt className="text-ink-muted">Workspace</dt>
        <dd className="min-w-0 truncate font-medium">{invitation.workspaceName}</dd>
        <dt className="text-ink-muted">Role</dt>
        <dd>
          <span className="font-medium">{roleLabels[invitation.role]}</span>
          <span className="block text-xs text-ink-muted">{roleSummaries[invitation.role]}</span>
        </dd>
        <dt className="text-ink-muted">E-mail</dt>
        <dd className="min-w-0 truncate">{invitation.email}</dd>
        <dt className="text-ink-muted">Link valid to</dt>
        <dd>
          <DateText value={invitation.expiresAt} withTime />{" "}
          <span className="text-xs text-ink-faint">UTC</span>
        </dd>
      </dl>
      <AcceptInvitationForm token={token} email={invitation.email} existing={existing} />
    </>
  );
}
