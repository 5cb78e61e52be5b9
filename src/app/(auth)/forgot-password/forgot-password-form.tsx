"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { forgotPasswordSchema } from "@/lib/auth/schemas";

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(forgotPasswordSchema), defaultValues: { email: "" } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson("POST", "/api/auth/forgot-password", values);
      setSentTo(values.email);
    } catch (error) {
      applyServerErrors(error, setError, ["email"]);
    }
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
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id="forgot-email"
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...register("email")}
      />
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting}>
          {isSubmitting ? "Sending…" : "Send reset link"}
        </Button>
      </FormActions>
    </form>
  );
}
