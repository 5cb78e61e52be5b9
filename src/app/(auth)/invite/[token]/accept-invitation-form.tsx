"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { z } from "zod";
import { sendJson } from "@/components/api-client";
import { AccountHint, ApiFormShell, NewPasswordField, useApiForm } from "@/components/api-form";
import { TextField } from "@/components/form";
import { password, profileSchema } from "@/lib/auth/schemas";
import { linkClass } from "../../_components/auth-heading";

interface Values {
  name: string;
  password: string;
}

// A new account needs a name and a real password; an existing one only proves itself with its password.
const newAccountSchema: z.ZodType<Values, Values> = z.object({ name: profileSchema.shape.name, password });
const existingAccountSchema: z.ZodType<Values, Values> = z.object({
  name: z.string(),
  password: z.string().min(1, { message: "Enter your password" }),
});

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
  const { onSubmit, bind, formState } = useApiForm<Values>({
    schema: existing ? existingAccountSchema : newAccountSchema,
    defaultValues: { name: "", password: "" },
    send: async (values) => {
      await sendJson("POST", "/api/invitations/accept", {
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
      onSubmit={onSubmit}
      error={formState.errors.root?.server?.message}
      label="Accept and join"
      pendingLabel="Joining…"
      pending={formState.isSubmitting || leaving}
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
