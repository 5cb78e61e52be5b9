"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { messageOf, requestJson } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";
import { invalidateProject } from "./api";

/** Archive (with a confirmation) or restore a project. */
export function ArchiveProject({ projectId, archived }: { projectId: string; archived: boolean }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [refreshing, startTransition] = useTransition();
  const [confirming, setConfirming] = useState(false);
  const archive = useMutation({
    mutationFn: (value: boolean) =>
      requestJson("POST", `/api/projects/${projectId}/archive`, { archived: value }),
    onSuccess: async () => {
      setConfirming(false);
      await invalidateProject(queryClient, projectId);
      startTransition(() => router.refresh());
    },
  });
  const pending = archive.isPending || refreshing;
  return (
    <div>
      {archived ? (
        <Button pending={pending} onClick={() => archive.mutate(false)}>
          Restore project
        </Button>
      ) : confirming ? (
        <span className="inline-flex items-center gap-2 text-sm">
          Archive this project?
          <Button variant="danger" pending={pending} onClick={() => archive.mutate(true)}>
            Archive
          </Button>
          <Button variant="quiet" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </span>
      ) : (
        <Button variant="danger" onClick={() => setConfirming(true)}>
          Archive project
        </Button>
      )}
      {archive.isError ? <FormMessage tone="error">{messageOf(archive.error)}</FormMessage> : null}
    </div>
  );
}
