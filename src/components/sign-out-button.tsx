"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, messageOf, requestJson } from "./api-client";
import { Button, InlineAlert } from "./form";

/** Ends this browser's session and goes to the sign-in page. */
export function SignOutButton({
  variant = "secondary",
  size = "md",
  className,
}: {
  variant?: "primary" | "secondary" | "quiet";
  size?: "sm" | "md";
  className?: string;
}) {
  const router = useRouter();
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function signOut() {
    setPending(true);
    setError(null);
    try {
      await requestJson("POST", "/api/auth/sign-out");
    } catch (e) {
      // A session that has already ended is as good as signed out.
      if (!(e instanceof ApiError && e.status === 401)) {
        setError(messageOf(e));
        setPending(false);
        return;
      }
    }
    router.replace("/sign-in");
    router.refresh();
  }

  return (
    <>
      <Button variant={variant} size={size} pending={pending} onClick={signOut} className={className}>
        Sign out
      </Button>
      <InlineAlert>{error}</InlineAlert>
    </>
  );
}
