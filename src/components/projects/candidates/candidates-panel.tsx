"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { Button, FormMessage } from "@/components/form";
import { costText } from "@/components/library/format";
import { Section } from "@/components/page-header";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { invalidateProject, type ProjectDetail } from "../api";
import { q } from "../format";
import { PartPicker } from "./part-picker";

/** The parts this project compares: a list with remove, and the library search to add one (project.write). */
export function CandidatesPanel({
  projectId,
  candidates,
  canWrite,
}: {
  projectId: string;
  candidates: ProjectDetail["candidates"];
  canWrite: boolean;
}) {
  const queryClient = useQueryClient();
  const [done, setDone] = useState<string | null>(null);
  const add = useMutation({
    mutationFn: (part: { id: string; partNumber: string }) =>
      sendJson("POST", `/api/projects/${projectId}/candidates`, { partId: part.id }),
    onSuccess: async (_data, part) => {
      setDone(`${part.partNumber} added; the results below include it.`);
      await invalidateProject(queryClient, projectId);
    },
  });
  const remove = useMutation({
    mutationFn: (part: { id: string; partNumber: string }) =>
      sendJson("DELETE", `/api/projects/${projectId}/candidates/${part.id}`),
    onSuccess: async (_data, part) => {
      setDone(`${part.partNumber} removed from the candidates.`);
      await invalidateProject(queryClient, projectId);
    },
  });
  const error = add.error ?? remove.error;
  const columns = canWrite ? 8 : 7;

  return (
    <Section
      id="candidates"
      title="Candidates"
      description="The library parts this design could use; every pulse is checked against each."
      aside={
        canWrite ? (
          <PartPicker
            exclude={new Set(candidates.map((c) => c.part.id))}
            busy={add.isPending}
            onPick={(part) => {
              setDone(null);
              add.mutate(part);
            }}
          />
        ) : null
      }
    >
      <Table label="Candidates">
        <thead>
          <tr>
            <Th>Part</Th>
            <Th>Maker</Th>
            <Th>Package</Th>
            <Th numeric>
              V<sub>DSS</sub>
            </Th>
            <Th>Library status</Th>
            <Th>Data</Th>
            <Th numeric>Unit cost</Th>
            {canWrite ? (
              <Th className="w-28">
                <span className="sr-only">Actions</span>
              </Th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {candidates.length === 0 ? (
            <EmptyRow colSpan={columns}>
              {canWrite
                ? "No candidates yet. Search the library at the right and add the parts to compare."
                : "No candidates yet. An engineer adds the parts to compare."}
            </EmptyRow>
          ) : (
            candidates.map(({ part, hasCurves }) => (
              <Tr key={part.id}>
                <Td>
                  <Link
                    href={`/library/${part.id}`}
                    className="font-medium hover:text-accent hover:underline"
                  >
                    {part.partNumber}
                  </Link>
                </Td>
                <Td className="text-ink-muted">{part.maker}</Td>
                <Td className="text-ink-muted">{part.package}</Td>
                <Td numeric>{q(part.vdsMax, "V")}</Td>
                <Td className="text-ink-muted">
                  {part.status}
                  {part.archivedAt ? ", archived" : ""}
                </Td>
                <Td className="text-ink-muted">
                  {hasCurves ? "SOA curves" : "no SOA curves yet"}
                  {part.foster?.length ? " · thermal model" : ""}
                </Td>
                <Td numeric>{costText(part.unitCost, part.currency)}</Td>
                {canWrite ? (
                  <Td className="text-right">
                    <Button
                      size="sm"
                      variant="quiet"
                      pending={remove.isPending && remove.variables?.id === part.id}
                      onClick={() => {
                        setDone(null);
                        remove.mutate({ id: part.id, partNumber: part.partNumber });
                      }}
                      aria-label={`Remove ${part.partNumber}`}
                    >
                      Remove
                    </Button>
                  </Td>
                ) : null}
              </Tr>
            ))
          )}
        </tbody>
      </Table>
      {error ? <FormMessage tone="error">{messageOf(error)}</FormMessage> : null}
      {done && !error ? (
        <p role="status" className="mt-2 text-xs text-ink-muted">
          {done}
        </p>
      ) : null}
    </Section>
  );
}
