"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { profileSchema } from "@/lib/auth/schemas";

export function ProfileForm({ name, email }: { name: string; email: string }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [saved, setSaved] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm({ resolver: zodResolver(profileSchema), defaultValues: { name } });

  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    try {
      await sendJson("PATCH", "/api/account/profile", values);
      reset(values);
      setSaved(true);
      startTransition(() => router.refresh());
    } catch (error) {
      applyServerErrors(error, setError, ["name"]);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="rounded-md border border-line bg-panel p-4">
      <div className="space-y-4">
        <TextField
          id="profile-name"
          label="Name"
          autoComplete="name"
          error={errors.name?.message}
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
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      {saved ? <FormMessage tone="done">Name saved.</FormMessage> : null}
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting || refreshing} disabled={!isDirty}>
          Save name
        </Button>
      </FormActions>
    </form>
  );
}
