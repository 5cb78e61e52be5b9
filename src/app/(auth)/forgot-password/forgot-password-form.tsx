"use client";

import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { ApiFormShell, EmailField, useApiForm } from "@/components/api-form";
import { FormMessage } from "@/components/form";

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { shell, bind } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.forgotPasswordSchema),
    defaultValues: { email: "" },
    send: async (values) => {
      await requestJson("POST", "/api/auth/forgot-password", values);
      setSentTo(values.email);
    },
  });

  if (sentTo) {
    return (
      <FormMessage tone="done">
        If an account exists for <strong className="font-medium">{sentTo}</strong>, a reset link is on its
        way. Check the inbox, and the spam folder, in a minute or two.
      </FormMessage>
    );
  }
  return (
    <ApiFormShell {...shell} label="Send reset link" pendingLabel="Sending…">
      <EmailField id="forgot-email" {...bind("email")} />
    </ApiFormShell>
  );
}
