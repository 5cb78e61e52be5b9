"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { requestJson } from "@/components/api-client";
import { useApiForm } from "@/components/api-form";
import { Button, FormMessage, SelectField, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { roleSummaries } from "@/components/role-text";
import type { Role } from "@/db/schema";
import { roleLabels } from "@/lib/auth/permissions";

export function InviteForm({ roles }: { roles: Role[] }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const defaultRole: Role = roles.includes("engineer") ? "engineer" : roles[0];
  const { onSubmit, register, reset, watch, formState } = useApiForm<{ email: string; role: Role }>({
    schema: () => import("@/lib/auth/schemas").then((m) => m.inviteSchema),
    defaultValues: { email: "", role: defaultRole },
    send: async (values) => {
      setSentTo(null);
      await requestJson("POST", "/api/team/invitations", values);
      setSentTo(values.email);
      reset({ email: "", role: values.role });
      startTransition(() => router.refresh());
    },
    onError: (error, setError) => {
      applyServerErrors(error, setError, ["email", "role"], {
        "conflict:member": "email",
        "forbidden:role": "role",
      });
      return true;
    },
  });
  const { errors, isSubmitting } = formState;
  const role = watch("role");

  return (
    <form onSubmit={onSubmit} noValidate className="rounded-md border border-line bg-panel p-4">
      <div className="grid items-start gap-4 md:grid-cols-[minmax(0,1fr)_minmax(0,20rem)_auto]">
        <TextField
          id="invite-email"
          label="E-mail"
          type="email"
          autoComplete="off"
          placeholder="name@company.example"
          error={errors.email?.message}
          {...register("email", { onChange: () => setSentTo(null) })}
        />
        <SelectField
          id="invite-role"
          label="Role"
          hint={roleSummaries[role]}
          error={errors.role?.message}
          {...register("role")}
        >
          {roles.map((r) => (
            <option key={r} value={r}>
              {roleLabels[r]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" variant="primary" pending={isSubmitting || refreshing} className="md:mt-6">
          {isSubmitting ? "Sending…" : "Send invitation"}
        </Button>
      </div>
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      {sentTo ? <FormMessage tone="done">Invitation sent to {sentTo}.</FormMessage> : null}
    </form>
  );
}
