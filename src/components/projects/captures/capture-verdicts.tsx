"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import { Sym } from "@/components/library/symbols";
import { VerdictBadge } from "@/components/verdict-shape";
import { explainFlag } from "@/lib/soa/explain";
import type { PulseResult } from "@/lib/soa/types";
import { q } from "../format";
import { UtilisationBar } from "../results/utilisation-bar";
import type { CaptureDetail } from "./capture-api";

type Candidate = CaptureDetail["candidates"][number];

/** A candidate's stored result: undefined while it is being rechecked, null where it has none. */
export function verdictOf(c: Candidate | undefined): PulseResult | null | undefined {
  return c?.stale ? undefined : (c?.result ?? null);
}

function columnsFor(limit: number): ColumnDef<Candidate>[] {
  return [
    {
      id: "candidate",
      header: "Candidate",
      cell: ({ row }) => row.original.partNumber,
      meta: { className: "font-medium", headerClassName: "" },
    },
    {
      id: "verdict",
      header: "Verdict",
      cell: ({ row }) => {
        const result = verdictOf(row.original);
        return result === undefined ? (
          <span className="text-ink-faint">being rechecked…</span>
        ) : (
          <VerdictBadge verdict={result?.verdict ?? "no-data"} />
        );
      },
      meta: { cellProps: (c) => ({ "data-verdict": verdictOf(c)?.verdict ?? "no-data" }) },
    },
    {
      id: "utilisation",
      header: "Utilisation",
      cell: ({ row }) => {
        const result = verdictOf(row.original);
        return result ? (
          <UtilisationBar utilisation={result.utilisation} limit={limit} verdict={result.verdict} />
        ) : (
          "—"
        );
      },
      meta: { className: "text-right" },
    },
    {
      id: "allowed",
      header: () => (
        <>
          Allowed <Sym main="I" sub="D" />
        </>
      ),
      cell: ({ row }) => q(verdictOf(row.original)?.allowedCurrent, "A"),
      meta: { numeric: true },
    },
    {
      id: "tjPeak",
      header: () => <Sym main="T" sub="j,peak" />,
      cell: ({ row: { original: c } }) => (
        <>
          {q(verdictOf(c)?.tjPeak ?? c.junction?.tjPeak, "°C")}
          {c.junction ? <span className="text-ink-faint"> / {q(c.tjMax, "°C")}</span> : null}
        </>
      ),
      meta: { numeric: true },
    },
    {
      id: "binding",
      header: "Binding sample",
      cell: ({ row }) => {
        const at = verdictOf(row.original)?.at;
        return at ? (
          <>
            <span className="num font-mono">
              {q(at.v, "V")} × {q(at.i, "A")}
            </span>
            <span className="block text-ink-faint">
              at {q(at.t, "s")}, read at {at.width === null ? "unlimited width" : q(at.width, "s")}
            </span>
          </>
        ) : (
          "—"
        );
      },
      meta: {
        className: "text-xs",
        headerClassName: "",
        cellProps: () => ({ "data-testid": "binding-cell" }),
      },
    },
    {
      id: "read",
      header: "How it was read",
      cell: ({ row }) => {
        const flags = verdictOf(row.original)?.flags;
        return flags?.length ? (
          <ul className="min-w-72 space-y-0.5 whitespace-normal">
            {flags.map((f) => (
              <li key={f}>{explainFlag(f)}</li>
            ))}
          </ul>
        ) : (
          "—"
        );
      },
      meta: { className: "max-w-md py-1.5 text-xs whitespace-normal text-ink-muted", headerClassName: "" },
    },
  ];
}

/** A capture's verdict against every candidate, with the sample that decided it and how it was read. */
export function CaptureVerdicts({
  name,
  candidates,
  limit,
}: {
  name: string;
  candidates: Candidate[];
  /** The project's utilisation limit, marked on each bar. */
  limit: number;
}) {
  return (
    <DataTable
      label={`Verdicts for ${name}`}
      columns={columnsFor(limit)}
      data={candidates}
      getRowId={(c) => c.partId}
    />
  );
}
