"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { requestJson } from "@/components/api-client";
import { ApiFormShell, useApiForm } from "@/components/api-form";
import { FormMessage, TextField } from "@/components/form";

export function ProfileForm({ name, email }: { name: string; email: string }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [saved, setSaved] = useState(false);
  const { shell, register, reset, formState } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.profileSchema),
    defaultValues: { name },
    send: async (values) => {
      setSaved(false);
      await requestJson("PATCH", "/api/account/profile", values);
      reset(values);
      setSaved(true);
      startTransition(() => router.refresh());
    },
  });

  return (
    <ApiFormShell
      {...shell}
      className="rounded-md border border-line bg-panel p-4"
      status={saved ? <FormMessage tone="done">Name saved.</FormMessage> : null}
      label="Save name"
      pending={shell.pending || refreshing}
      disabled={!formState.isDirty}
    >
      <div className="space-y-4">
        <TextField
          id="profile-name"
          label="Name"
          autoComplete="name"
          error={formState.errors.name?.message}
          {...register("name", { onChange: () => setSaved(false) })}
        />
        <TextField
          id="profile-email"
          label="E-mail"
          value={email}
          readOnly
          disabled
          hint="Your sign-in address; invitations and reset links go here."
        />
      </div>
    </ApiFormShell>
  );
}
