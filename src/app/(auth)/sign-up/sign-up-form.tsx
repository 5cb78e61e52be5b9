"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { signUpSchema } from "@/lib/auth/schemas";

export function SignUpForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: "", email: "", password: "", workspaceName: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson("POST", "/api/auth/sign-up", values);
      setSentTo(values.email);
    } catch (error) {
      applyServerErrors(error, setError, ["name", "email", "password", "workspaceName"]);
    }
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
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id="sign-up-name"
        label="Your name"
        autoComplete="name"
        error={errors.name?.message}
        {...register("name")}
      />
      <TextField
        id="sign-up-email"
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...register("email")}
      />
      <TextField
        id="sign-up-password"
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={errors.password?.message}
        {...register("password")}
      />
      <TextField
        id="sign-up-workspace"
        label="Workspace name"
        autoComplete="organization"
        hint="Usually the lab or group, e.g. “Drive electronics bench”."
        error={errors.workspaceName?.message}
        {...register("workspaceName")}
      />
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting}>
          {isSubmitting ? "Sending…" : "Create workspace"}
        </Button>
      </FormActions>
    </form>
  );
}
