"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { ApiError, sendJson } from "@/components/api-client";
import { Button, FormActions, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { resetPasswordSchema } from "@/lib/auth/schemas";
import { linkClass } from "../../_components/auth-heading";

const formSchema = resetPasswordSchema.pick({ password: true });

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [leaving, setLeaving] = useState(false);
  const [deadLink, setDeadLink] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(formSchema), defaultValues: { password: "" } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson("POST", "/api/auth/reset-password", { token, password: values.password });
      setLeaving(true);
      router.replace("/sign-in?reset=done");
    } catch (error) {
      if (error instanceof ApiError && (error.status === 404 || error.fieldErrors.token)) {
        setDeadLink(true);
        setError("root.server", { type: "server", message: "This reset link is not valid any more." });
        return;
      }
      applyServerErrors(error, setError, ["password"]);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <TextField
        id="reset-password"
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={errors.password?.message}
        {...register("password")}
      />
      {errors.root?.server ? (
        <FormMessage tone="error">
          {errors.root.server.message}
          {deadLink ? (
            <>
              {" "}
              <Link href="/forgot-password" className={linkClass}>
                Ask for a new link
              </Link>
            </>
          ) : null}
        </FormMessage>
      ) : null}
      <FormActions>
        <Button type="submit" variant="primary" pending={isSubmitting || leaving} disabled={deadLink}>
          {isSubmitting || leaving ? "Saving…" : "Save password"}
        </Button>
      </FormActions>
    </form>
  );
}
