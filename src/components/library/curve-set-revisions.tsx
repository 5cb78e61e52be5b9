"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useTransition } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { DateText } from "@/components/date-text";
import { Button } from "@/components/form";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { CURVE_FORMS } from "@/lib/vocabulary";
import { sizeText } from "./format";

export interface CurveSetRow {
  id: string;
  fileName: string;
  size: number;
  shape: string;
  active: boolean;
  createdAt: Date | string;
  uploadedBy: string | null;
}

/** Every curve set the part has had (datasheet revisions), newest first; one is active. */
export function CurveSetRevisions({
  partId,
  sets,
  canWrite,
}: {
  partId: string;
  sets: CurveSetRow[];
  canWrite: boolean;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [refreshing, startTransition] = useTransition();
  const activate = useMutation({
    mutationFn: (setId: string) => sendJson("POST", `/api/parts/${partId}/curve-sets/${setId}/activate`),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: ["part-limits", partId] });
      startTransition(() => router.refresh());
    },
  });
  return (
    <div className="space-y-2">
      <Table label="Curve-set revisions">
        <thead>
          <tr>
            <Th>File</Th>
            <Th>Form</Th>
            <Th numeric>Size</Th>
            <Th>Uploaded by</Th>
            <Th numeric>Uploaded (UTC)</Th>
            <Th>State</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {sets.length === 0 ? (
            <EmptyRow colSpan={7}>No curve sets yet.</EmptyRow>
          ) : (
            sets.map((set) => (
              <Tr key={set.id}>
                <Td className="max-w-64 truncate font-medium" title={set.fileName}>
                  {set.fileName}
                </Td>
                <Td className="text-ink-muted">
                  {set.shape === "paired" ? CURVE_FORMS.paired : CURVE_FORMS.long}
                </Td>
                <Td numeric>{sizeText(set.size)}</Td>
                <Td>{set.uploadedBy ?? <span className="text-ink-faint">—</span>}</Td>
                <Td numeric>
                  <DateText value={set.createdAt} withTime />
                </Td>
                <Td>
                  {set.active ? (
                    <span className="inline-flex items-center gap-1.5 text-accent">
                      <svg width="8" height="8" viewBox="0 0 8 8" aria-hidden="true">
                        <circle cx="4" cy="4" r="3.5" fill="currentColor" />
                      </svg>
                      active
                    </span>
                  ) : (
                    <span className="text-ink-faint">earlier</span>
                  )}
                </Td>
                <Td className="text-right">
                  <span className="inline-flex items-center gap-2">
                    <a
                      href={`/api/parts/${partId}/curve-sets/${set.id}/file`}
                      className="text-sm text-accent hover:underline"
                      aria-label={`Download the original ${set.fileName}`}
                    >
                      Download original
                    </a>
                    {canWrite && !set.active ? (
                      <Button
                        size="sm"
                        pending={(activate.isPending && activate.variables === set.id) || refreshing}
                        onClick={() => activate.mutate(set.id)}
                      >
                        Make active
                      </Button>
                    ) : null}
                  </span>
                </Td>
              </Tr>
            ))
          )}
        </tbody>
      </Table>
      {activate.isError ? (
        <p role="alert" className="text-sm text-fail">
          {messageOf(activate.error)}
        </p>
      ) : null}
    </div>
  );
}
