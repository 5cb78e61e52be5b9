"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { requestJson } from "@/components/api-client";
import { ApiFormShell, EmailField, useApiForm } from "@/components/api-form";
import { TextField } from "@/components/form";
import { linkClass } from "../_components/auth-heading";

export function SignInForm({ next }: { next: string | null }) {
  const router = useRouter();
  const [leaving, setLeaving] = useState(false);
  const { shell, bind } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.signInSchema),
    defaultValues: { email: "", password: "" },
    send: async (values) => {
      await requestJson("POST", "/api/auth/sign-in", values);
      setLeaving(true);
      router.replace(next ?? "/app");
      router.refresh();
    },
  });

  return (
    <ApiFormShell
      {...shell}
      label="Sign in"
      pendingLabel="Signing in…"
      pending={shell.pending || leaving}
      after={
        // After the button in the page's order: Tab goes e-mail → password → Sign in.
        <p className="text-right">
          <Link href="/forgot-password" className={`text-sm ${linkClass}`}>
            Forgot password?
          </Link>
        </p>
      }
    >
      <EmailField id="sign-in-email" {...bind("email")} />
      <TextField
        id="sign-in-password"
        label="Password"
        type="password"
        autoComplete="current-password"
        {...bind("password")}
      />
    </ApiFormShell>
  );
}
