"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, requestJson } from "@/components/api-client";
import { Button, FormActions, FormMessage } from "@/components/form";
import { linkClass } from "../../../_components/auth-heading";

// A button, not an automatic request on opening: mail scanners that open links must not create accounts.
export function ConfirmSignUpForm({ token }: { token: string }) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<{ message: string; next: "sign-up" | "sign-in" | null } | null>(
    null,
  );

  async function confirm() {
    setPending(true);
    setProblem(null);
    try {
      await requestJson("POST", "/api/auth/sign-up/confirm", { token });
      router.replace("/app");
      router.refresh();
    } catch (error) {
      setPending(false);
      if (error instanceof ApiError && error.status === 404) {
        setProblem({ message: "This sign-up link is not valid any more: used or expired.", next: "sign-up" });
      } else if (error instanceof ApiError && error.status === 409) {
        setProblem({ message: error.message, next: "sign-in" });
      } else {
        setProblem({ message: error instanceof Error ? error.message : "Something went wrong.", next: null });
      }
    }
  }

  return (
    <div>
      {problem ? (
        <FormMessage tone="error">
          {problem.message}{" "}
          {problem.next === "sign-up" ? (
            <Link href="/sign-up" className={linkClass}>
              Sign up again
            </Link>
          ) : problem.next === "sign-in" ? (
            <Link href="/sign-in" className={linkClass}>
              Sign in
            </Link>
          ) : null}
        </FormMessage>
      ) : null}
      <FormActions>
        <Button type="button" variant="primary" pending={pending} onClick={confirm}>
          {pending ? "Creating…" : "Create my workspace"}
        </Button>
      </FormActions>
    </div>
  );
}
