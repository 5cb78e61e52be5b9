"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, requestJson } from "@/components/api-client";
import { ApiFormShell, NewPasswordField, useApiForm } from "@/components/api-form";
import { linkClass } from "../../_components/auth-heading";

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [leaving, setLeaving] = useState(false);
  const [deadLink, setDeadLink] = useState(false);
  const { shell, bind, formState } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.resetPasswordFormSchema),
    defaultValues: { password: "" },
    send: async (values) => {
      await requestJson("POST", "/api/auth/reset-password", { token, password: values.password });
      setLeaving(true);
      router.replace("/sign-in?reset=done");
    },
    onError: (error, setError) => {
      if (!(error instanceof ApiError && (error.status === 404 || error.fieldErrors.token))) return false;
      setDeadLink(true);
      setError("root.server", { type: "server", message: "This reset link is not valid any more." });
      return true;
    },
  });
  const serverError = formState.errors.root?.server;

  return (
    <ApiFormShell
      {...shell}
      error={
        serverError ? (
          <>
            {serverError.message}
            {deadLink ? (
              <>
                {" "}
                <Link href="/forgot-password" className={linkClass}>
                  Ask for a new link
                </Link>
              </>
            ) : null}
          </>
        ) : null
      }
      label="Save password"
      pendingLabel="Saving…"
      pending={shell.pending || leaving}
      disabled={deadLink}
    >
      <NewPasswordField id="reset-password" label="New password" {...bind("password")} />
    </ApiFormShell>
  );
}
