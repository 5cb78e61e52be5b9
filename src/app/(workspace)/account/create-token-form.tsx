"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { requestJson } from "@/components/api-client";
import { useApiForm } from "@/components/api-form";
import { Button, FormMessage, TextField } from "@/components/form";
import { TokenSecret } from "./token-secret";

interface CreatedToken {
  id: string;
  name: string;
  prefix: string;
  secret: string;
}

export function CreateTokenForm({ workspaceName }: { workspaceName: string }) {
  const router = useRouter();
  const [refreshing, startTransition] = useTransition();
  const [created, setCreated] = useState<CreatedToken | null>(null);
  const { onSubmit, bind, reset, formState } = useApiForm({
    schema: () => import("@/lib/auth/schemas").then((m) => m.createTokenSchema),
    defaultValues: { name: "" },
    send: async (values) => {
      const { token } = await requestJson<{ token: CreatedToken }>("POST", "/api/account/tokens", values);
      setCreated(token);
      reset();
      startTransition(() => router.refresh());
    },
  });
  return (
    <div className="space-y-4">
      <form onSubmit={onSubmit} noValidate className="rounded-md border border-line bg-panel p-4">
        <div className="flex items-start gap-3">
          <TextField
            id="token-name"
            label="New token"
            placeholder="e.g. Bench 3 pulse rig"
            autoComplete="off"
            hint={`Acts in ${workspaceName}, the workspace you are in now.`}
            className="max-w-md flex-1"
            {...bind("name")}
          />
          <Button
            type="submit"
            variant="primary"
            pending={formState.isSubmitting || refreshing}
            className="mt-6 ml-auto"
          >
            Create token
          </Button>
        </div>
        <FormMessage tone="error">{formState.errors.root?.server?.message}</FormMessage>
      </form>
      {created ? <TokenSecret token={created} onDone={() => setCreated(null)} /> : null}
    </div>
  );
}
