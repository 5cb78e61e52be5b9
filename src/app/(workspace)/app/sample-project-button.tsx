"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, InlineAlert } from "@/components/form";

/** Adds the invented sample project in one click and opens it. */
export function SampleProjectButton({ variant = "primary" }: { variant?: "primary" | "secondary" }) {
  const router = useRouter();
  const [navigating, startTransition] = useTransition();
  const add = useMutation({
    mutationFn: () => requestJson<{ project: { id: string } }>("POST", "/api/projects/sample"),
    onSuccess: ({ project }) => startTransition(() => router.push(`/projects/${project.id}`)),
  });
  return (
    <span className="inline-flex flex-col items-start gap-1">
      <Button variant={variant} pending={add.isPending || navigating} onClick={() => add.mutate()}>
        {add.isPending ? "Adding the sample…" : "Add a sample project"}
      </Button>
      <InlineAlert>{add.isError ? messageOf(add.error) : null}</InlineAlert>
    </span>
  );
}
