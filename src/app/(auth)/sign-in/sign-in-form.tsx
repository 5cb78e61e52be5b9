"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { signInSchema } from "@/lib/auth/schemas";
import { linkClass } from "../_components/auth-heading";

export function SignInForm({ next }: { next: string | null }) {
  const router = useRouter();
  const [leaving, setLeaving] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson("POST", "/api/auth/sign-in", values);
      setLeaving(true);
      router.replace(next ?? "/app");
      router.refresh();
    } catch (error) {
      applyServerErrors(error, setError, ["email", "password"]);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id="sign-in-email"
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...register("email")}
      />
      <TextField
        id="sign-in-password"
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register("password")}
      />
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting || leaving}>
          {isSubmitting || leaving ? "Signing in…" : "Sign in"}
        </Button>
      </FormActions>
      {/* After the button in the page's order: Tab goes e-mail → password → Sign in. */}
      <p className="text-right">
        <Link href="/forgot-password" className={`text-sm ${linkClass}`}>
          Forgot password?
        </Link>
      </p>
    </form>
  );
}
