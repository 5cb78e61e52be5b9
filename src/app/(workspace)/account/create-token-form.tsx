"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { sendJson } from "@/components/api-client";
import { Button, FormMessage, TextField } from "@/components/form";
import { applyServerErrors } from "@/components/form-errors";
import { createTokenSchema } from "@/lib/auth/schemas";
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
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(createTokenSchema), defaultValues: { name: "" } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { token } = await sendJson<{ token: CreatedToken }>("POST", "/api/account/tokens", values);
      setCreated(token);
      reset();
      startTransition(() => router.refresh());
    } catch (error) {
      applyServerErrors(error, setError, ["name"]);
    }
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
            error={errors.name?.message}
            className="max-w-md flex-1"
            {...register("name")}
          />
          <Button
            type="submit"
            variant="primary"
            pending={isSubmitting || refreshing}
            className="mt-6 ml-auto"
          >
            Create token
          </Button>
        </div>
        <FormMessage tone="error">{errors.root?.server?.message}</FormMessage>
      </form>
      {created ? <TokenSecret token={created} onDone={() => setCreated(null)} /> : null}
    </div>
  );
}
