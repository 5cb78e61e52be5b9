"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { messageOf, sendJson } from "@/components/api-client";
import { ConfirmDelete } from "@/components/confirm-delete";
import { DateText } from "@/components/date-text";
import { FormMessage } from "@/components/form";
import { Sym } from "@/components/library/symbols";
import { EmptyRow, Table, Td, Th, Tr } from "@/components/table";
import { VerdictBadge } from "@/components/verdict-shape";
import { can } from "@/lib/auth/permissions";
import { invalidateProject, type MeasuredRecord, type ProjectCheck } from "../api";
import { q, repeatOf, repeatText } from "../format";
import type { Person, Viewer } from "../project-workspace";

/**
 * The measured pulses saved so far, newest last, with who logged each and when, the bench setup, and the worst
 * verdict over the candidates (each opens in the results). Authors delete their own rows; leads and admins any.
 */
export function MeasuredTable({
  projectId,
  rows,
  check,
  viewer,
  canMeasure,
  people,
}: {
  projectId: string;
  rows: MeasuredRecord[];
  check: ProjectCheck | undefined;
  viewer: Viewer;
  canMeasure: boolean;
  people: Person[];
}) {
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState<string | null>(null);
  const names = new Map(people.map((p) => [p.id, p.name]));
  const mayDeleteAny = can(viewer.role, "measurement.manage");
  const remove = useMutation({
    mutationFn: (id: string) => sendJson("DELETE", `/api/projects/${projectId}/measurements/${id}`),
    onSuccess: async () => {
      setConfirming(null);
      await invalidateProject(queryClient, projectId);
    },
  });
  const columns = canMeasure ? 10 : 9;

  return (
    <>
      <Table label="Measured pulses">
        <thead>
          <tr>
            <Th>Label</Th>
            <Th numeric>
              <Sym main="V" sub="DS" />
            </Th>
            <Th numeric>
              <Sym main="I" sub="D" />
            </Th>
            <Th numeric>Width</Th>
            <Th>Repetition</Th>
            <Th>Worst verdict</Th>
            <Th>Bench</Th>
            <Th>Logged by</Th>
            <Th numeric>When (UTC)</Th>
            {canMeasure ? (
              <Th className="w-32">
                <span className="sr-only">Actions</span>
              </Th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <EmptyRow colSpan={columns}>
              {canMeasure
                ? "No measured pulses yet. Paste the bench's rows above and preview them."
                : "No measured pulses yet. Technicians log what the bench measured here."}
            </EmptyRow>
          ) : null}
          {rows.map((row) => {
            const worst = check?.worstByPulse[row.id];
            const mine = row.createdBy === viewer.id;
            const bench = [row.boardSerial && `board ${row.boardSerial}`, row.probe, row.note]
              .filter(Boolean)
              .join(" · ");
            return (
              <Tr key={row.id}>
                <Td className="font-medium">
                  <Link
                    href={`/projects/${projectId}?pulse=${row.id}`}
                    className="hover:text-accent hover:underline"
                  >
                    {row.label}
                  </Link>
                  <span className="ml-2 text-xs font-normal text-ink-faint">
                    {row.kind === "rect" ? "rect" : "triangle"}
                  </span>
                </Td>
                <Td numeric>{q(row.v, "V")}</Td>
                <Td numeric>{q(row.i, "A")}</Td>
                <Td numeric>{q(row.duration, "s")}</Td>
                <Td className="text-ink-muted">{repeatText(repeatOf(row)) ?? "single"}</Td>
                <Td>
                  {worst ? <VerdictBadge verdict={worst} /> : <span className="text-ink-faint">—</span>}
                </Td>
                <Td className="max-w-56 truncate text-ink-muted" title={bench || undefined}>
                  {bench || "—"}
                </Td>
                <Td className="text-ink-muted">
                  {row.createdBy ? (mine ? "you" : (names.get(row.createdBy) ?? "a former member")) : "—"}
                </Td>
                <Td numeric>
                  <DateText value={row.createdAt} withTime />
                </Td>
                {canMeasure ? (
                  <Td className="text-right">
                    {mine || mayDeleteAny ? (
                      <ConfirmDelete
                        label={row.label}
                        confirming={confirming === row.id}
                        pending={remove.isPending}
                        onAsk={() => setConfirming(row.id)}
                        onConfirm={() => remove.mutate(row.id)}
                        onKeep={() => setConfirming(null)}
                      />
                    ) : null}
                  </Td>
                ) : null}
              </Tr>
            );
          })}
        </tbody>
      </Table>
      {remove.isError ? <FormMessage tone="error">{messageOf(remove.error)}</FormMessage> : null}
    </>
  );
}
