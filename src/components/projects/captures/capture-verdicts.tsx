"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { Caution } from "@/components/caution";
import { DataTable } from "@/components/data-table";
import { Sym } from "@/components/library/symbols";
import { VerdictBadge } from "@/components/verdict-shape";
import { q } from "@/lib/format";
import { explainFlag } from "@/lib/soa/explain";
import { UtilisationBar } from "../results/utilisation-bar";
import type { CaptureDetail } from "./capture-api";
import type { VerdictOf } from "./capture-traces";

type Candidate = CaptureDetail["candidates"][number];

function startWords(start: "rest" | "steady" | null): string {
  if (start === "rest") return "rest (as stated at upload)";
  if (start === "steady") return "the first sample's level, settled (as stated at upload)";
  return "rest, or from the first sample's level where the record begins mid-pulse";
}

function columnsFor(limit: number, verdictOf: VerdictOf): ColumnDef<Candidate>[] {
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
        const result = verdictOf(row.original.partId);
        return result === undefined ? (
          <span className="text-ink-faint">being rechecked…</span>
        ) : (
          <VerdictBadge verdict={result?.verdict ?? "no-data"} />
        );
      },
      meta: { cellProps: (c) => ({ "data-verdict": verdictOf(c.partId)?.verdict ?? "no-data" }) },
    },
    {
      id: "utilisation",
      header: "Utilisation",
      cell: ({ row }) => {
        const result = verdictOf(row.original.partId);
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
      cell: ({ row }) => q(verdictOf(row.original.partId)?.allowedCurrent, "A"),
      meta: { numeric: true },
    },
    {
      id: "tjPeak",
      header: () => <Sym main="T" sub="j,peak" />,
      cell: ({ row: { original: c } }) => (
        <>
          {q(verdictOf(c.partId)?.tjPeak ?? c.junction?.tjPeak, "°C")}
          {c.junction ? <span className="text-ink-faint"> / {q(c.tjMax, "°C")}</span> : null}
        </>
      ),
      meta: { numeric: true },
    },
    {
      id: "binding",
      header: "Binding sample",
      cell: ({ row }) => {
        const at = verdictOf(row.original.partId)?.at;
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
        const flags = verdictOf(row.original.partId)?.flags;
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

/** Each candidate's stored verdict on the capture, with how the engine read it, and what the verdicts rest on. */
export function CaptureVerdicts({
  detail,
  verdictOf,
  utilisationLimit,
}: {
  detail: CaptureDetail;
  verdictOf: VerdictOf;
  utilisationLimit: number;
}) {
  const { capture, candidates, caseTemp } = detail;
  const heatedCase = detail.case ?? null;
  return (
    <div>
      <DataTable
        label={`Verdicts for ${capture.name}`}
        columns={columnsFor(utilisationLimit, verdictOf)}
        data={candidates}
        getRowId={(c) => c.partId}
      />
      <p className="mt-2 text-xs text-ink-muted">
        Every sample is read on the curves at its own voltage and at its own width (the record&apos;s energy
        over its power, at most the record&apos;s length); the binding sample, marked on the traces, decided
        the curve verdict. The junction temperature runs from {startWords(capture.start)} at{" "}
        {q(caseTemp, "°C")} case through every sample, between samples included, where the part has a thermal
        model.
        {heatedCase
          ? ` The project's case path heats the case from the same power (dashed T_C, up to ${q(heatedCase.tjPeak, "°C")}); each junction trace includes that rise. Driving the case path with the full power overstates the case rise, so this is conservative.`
          : null}
      </p>
      <Caution className="mt-2" />
    </div>
  );
}
