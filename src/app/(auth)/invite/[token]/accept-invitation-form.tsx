"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { AccountHint, ApiFormShell, NewPasswordField, useApiForm } from "@/components/api-form";
import { TextField } from "@/components/form";
import { linkClass } from "../../_components/auth-heading";

interface Values {
  name: string;
  password: string;
}

export function AcceptInvitationForm({
  token,
  email,
  existing,
}: {
  token: string;
  email: string;
  existing: boolean;
}) {
  const router = useRouter();
  const [leaving, setLeaving] = useState(false);
  const { shell, bind } = useApiForm<Values>({
    schema: () =>
      import("@/lib/auth/schemas").then((m) =>
        existing ? m.inviteExistingAccountSchema : m.inviteNewAccountSchema,
      ),
    defaultValues: { name: "", password: "" },
    send: async (values) => {
      await requestJson("POST", "/api/invitations/accept", {
        token,
        password: values.password,
        ...(existing ? {} : { name: values.name }),
      });
      setLeaving(true);
      router.replace("/app");
      router.refresh();
    },
  });
  const passwordField = { id: "invite-password", ...bind("password") };

  return (
    <ApiFormShell
      {...shell}
      label="Accept and join"
      pendingLabel="Joining…"
      pending={shell.pending || leaving}
    >
      <AccountHint email={email} />
      {existing ? null : (
        <TextField id="invite-name" label="Your name" autoComplete="name" {...bind("name")} />
      )}
      {existing ? (
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          labelAside={
            <Link href="/forgot-password" className={`text-xs ${linkClass}`}>
              Forgot password?
            </Link>
          }
          {...passwordField}
        />
      ) : (
        <NewPasswordField label="Choose a password" {...passwordField} />
      )}
    </ApiFormShell>
  );
}
