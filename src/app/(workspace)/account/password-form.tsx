"use client";

import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { AccountHint, ApiFormShell, NewPasswordField, useApiForm } from "@/components/api-form";
import { FormMessage, TextField } from "@/components/form";

export function PasswordForm({ email }: { email: string }) {
  const [changed, setChanged] = useState(false);
  const { shell, bind, reset } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.changePasswordSchema),
    defaultValues: { currentPassword: "", newPassword: "" },
    send: async (values) => {
      setChanged(false);
      await requestJson("POST", "/api/account/password", values);
      reset();
      setChanged(true);
    },
  });

  return (
    <ApiFormShell
      {...shell}
      className="rounded-md border border-line bg-panel p-4"
      status={
        changed ? (
          <FormMessage tone="done">Password changed. Your other sessions are signed out.</FormMessage>
        ) : null
      }
      label="Change password"
    >
      <AccountHint email={email} />
      <div className="space-y-4">
        <TextField
          id="current-password"
          label="Current password"
          type="password"
          autoComplete="current-password"
          {...bind("currentPassword")}
        />
        <NewPasswordField id="new-password" label="New password" {...bind("newPassword")} />
      </div>
    </ApiFormShell>
  );
}
