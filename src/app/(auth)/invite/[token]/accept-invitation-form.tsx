"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
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
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    resolver: zodResolver(existing ? existingAccountSchema : newAccountSchema),
    defaultValues: { name: "", password: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson("POST", "/api/invitations/accept", {
        token,
        password: values.password,
        ...(existing ? {} : { name: values.name }),
      });
      setLeaving(true);
      router.replace("/app");
      router.refresh();
    } catch (error) {
      applyServerErrors(error, setError, ["name", "password"]);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {/* Lets password managers file the new password under the right account. */}
      <input type="hidden" name="username" autoComplete="username" value={email} readOnly />
      {existing ? null : (
        <TextField
          id="invite-name"
          label="Your name"
          autoComplete="name"
          error={errors.name?.message}
          {...register("name")}
        />
      )}
      <TextField
        id="invite-password"
        label={existing ? "Password" : "Choose a password"}
        type="password"
        autoComplete={existing ? "current-password" : "new-password"}
        hint={existing ? undefined : "At least 10 characters."}
        labelAside={
          existing ? (
            <Link href="/forgot-password" className={`text-xs ${linkClass}`}>
              Forgot password?
            </Link>
          ) : undefined
        }
        error={errors.password?.message}
        {...register("password")}
      />
      <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting || leaving}>
          {isSubmitting || leaving ? "Joining…" : "Accept and join"}
        </Button>
      </FormActions>
    </form>
  );
}
