import type { Metadata } from "next";
import { PageHeader, Section } from "@/components/page-header";
import { listApiTokens } from "@/db/queries/api-tokens";
import { getNoticePreferences } from "@/lib/auth/notice-preferences";
import { requireMember } from "@/lib/auth/page";
import { CreateTokenForm } from "./create-token-form";
import { LazyTokensTable } from "./lazy-tokens-table";
import { NoticePreferencesForm } from "./notice-preferences-form";
import { PasswordForm } from "./password-form";
import { ProfileForm } from "./profile-form";
import { SignOutEverywhere } from "./sign-out-everywhere";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const member = await requireMember();
  const [tokens, notices] = await Promise.all([
    listApiTokens({ userId: member.user.id }),
    getNoticePreferences(member.user.id),
  ]);
  const workspaceNames = new Map(member.workspaces.map((w) => [w.id, w.name]));
  const active = tokens.filter((t) => !t.revokedAt).length;

  return (
    <div className="space-y-8">
      <PageHeader title="Account" context={member.user.email} />

      <div className="grid items-start gap-6 lg:grid-cols-2">
        <Section
          id="profile"
          title="Profile"
          description="How the team sees you in members lists and audit records."
        >
          <ProfileForm name={member.user.name} email={member.user.email} />
        </Section>
        <Section id="password" title="Password" description="Changing it signs out your other sessions.">
          <PasswordForm email={member.user.email} />
        </Section>
      </div>

      <Section
        id="notices"
        title="Notices"
        description="Which e-mails Pulsefence sends you about the team's work, in every workspace you are in."
      >
        <NoticePreferencesForm preferences={notices} />
      </Section>

      <Section
        id="tokens"
        title="API tokens"
        description={
          <>
            A token lets a bench script post measurements and get verdicts back through{" "}
            <code className="font-mono text-xs">/api/v1</code>, acting as you with your role in the workspace
            it was made in. {active} active.
          </>
        }
      >
        <CreateTokenForm workspaceName={member.workspace.name} />
        <div className="mt-4">
          <LazyTokensTable
            tokens={tokens.map((t) => ({ ...t, workspaceName: workspaceNames.get(t.workspaceId) ?? null }))}
          />
        </div>
      </Section>

      <Section id="sessions" title="Sessions">
        <SignOutEverywhere />
      </Section>
    </div>
  );
}
