"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";

/** Ends every session of the account, this one too: for a lost laptop or a shared bench PC. */
export function SignOutEverywhere() {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const signOut = useMutation({
    mutationFn: () => requestJson("POST", "/api/auth/sign-out-everywhere"),
    onSuccess: () => {
      router.replace("/sign-in");
      router.refresh();
    },
  });

  return (
    <div className="rounded-md border border-line bg-panel p-4">
      <div className="flex items-center justify-between gap-6">
        <p className="text-sm text-ink-muted">
          Sign out on every browser and device where you are signed in, this one included. API tokens keep
          working; revoke them above if they are at risk too.
        </p>
        {confirming ? (
          <span className="flex shrink-0 items-center gap-2">
            <Button variant="quiet" onClick={() => setConfirming(false)}>
              Cancel
            </Button>
            <Button
              variant="danger"
              pending={signOut.isPending || signOut.isSuccess}
              onClick={() => signOut.mutate()}
            >
              Sign out everywhere now
            </Button>
          </span>
        ) : (
          <Button onClick={() => setConfirming(true)}>Sign out everywhere…</Button>
        )}
      </div>
      {signOut.isError ? <FormMessage tone="error">{messageOf(signOut.error)}</FormMessage> : null}
    </div>
  );
}
