"use client";

import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { ApiFormShell, EmailField, NewPasswordField, useApiForm } from "@/components/api-form";
import { FormMessage, TextField } from "@/components/form";

export function SignUpForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { shell, bind } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.signUpSchema),
    defaultValues: { name: "", email: "", password: "", workspaceName: "" },
    send: async (values) => {
      await requestJson("POST", "/api/auth/sign-up", values);
      setSentTo(values.email);
    },
  });

  if (sentTo) {
    return (
      <FormMessage tone="done">
        Check your e-mail: a link to finish creating your workspace is on its way to{" "}
        <strong className="font-medium">{sentTo}</strong>. It works once, for 24 hours. Nothing arrived in a
        few minutes? Look in the spam folder, or sign up again.
      </FormMessage>
    );
  }

  return (
    <ApiFormShell {...shell} label="Create workspace" pendingLabel="Sending…">
      <TextField id="sign-up-name" label="Your name" autoComplete="name" {...bind("name")} />
      <EmailField id="sign-up-email" {...bind("email")} />
      <NewPasswordField id="sign-up-password" label="Password" {...bind("password")} />
      <TextField
        id="sign-up-workspace"
        label="Workspace name"
        autoComplete="organization"
        hint="Usually the lab or group, e.g. “Drive electronics bench”."
        {...bind("workspaceName")}
      />
    </ApiFormShell>
  );
}
