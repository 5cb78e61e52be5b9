"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { changePasswordSchema } from "@/lib/auth/schemas";

export function PasswordForm({ email }: { email: string }) {
  const [changed, setChanged] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(changePasswordSchema),
    defaultValues: { currentPassword: "", newPassword: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setChanged(false);
    try {
      await sendJson("POST", "/api/account/password", values);
      reset();
      setChanged(true);
    } catch (error) {
      applyServerErrors(error, setError, ["currentPassword", "newPassword"]);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="rounded-md border border-line bg-panel p-4">
      {/* Lets password managers file the new password under the right account. */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      <div className="space-y-4">
        <TextField
          id="current-password"
          label="Current password"
          type="password"
          autoComplete="current-password"
          error={errors.currentPassword?.message}
          {...register("currentPassword")}
        />
        <TextField
          id="new-password"
          label="New password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          error={errors.newPassword?.message}
          {...register("newPassword")}
        />
      </div>
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      {changed ? (
        <FormMessage tone="done">Password changed. Your other sessions are signed out.</FormMessage>
      ) : null}
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting}>
          Change password
        </Button>
      </FormActions>
    </form>
  );
}
