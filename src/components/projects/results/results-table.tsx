"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { useEffect, useRef, useState } from "react";
import { DataTable } from "@/components/data-table";
import { DisclosureChevron } from "@/components/disclosure-chevron";
import { Sym } from "@/components/library/symbols";
import { VerdictBadge } from "@/components/verdict-shape";
import { factor, q, repeatText } from "@/lib/format";
import { pulseShape, shapeWords } from "@/lib/vocabulary";
import type { CheckedPulse, ProjectCheck } from "../api";
import { pulseFigureColumns } from "../pulse-columns";
import { ResultDetails } from "./result-details";
import { UtilisationBar } from "./utilisation-bar";

const groups = [
  { source: "fault-case", title: "Fault cases" },
  { source: "measured", title: "Measured pulses" },
  { source: "capture", title: "Captures" },
] as const;

function shapeNote(pulse: CheckedPulse): string {
  if (pulse.kind === "waveform") return `${pulseShape(pulse)}, every sample read at its own width`;
  if (pulse.kind === "avalanche") return `${shapeWords.avalanche}, energy against the avalanche rating`;
  return `${shapeWords[pulse.kind]}, ${repeatText(pulse.repeat) ?? "single pulse"}`;
}

const num = { numeric: true, headerClassName: "py-1.5 align-bottom" };

/** The pulse column: a button that opens the row's explanation, with the pulse's name and shape. */
function PulseName({
  pulse,
  expanded,
  onToggle,
}: {
  pulse: CheckedPulse;
  expanded: boolean;
  onToggle: () => void;
}) {
  return (
    <button
      type="button"
      aria-expanded={expanded}
      aria-controls={`explain-${pulse.id}`}
      onClick={onToggle}
      className="inline-flex max-w-60 items-center gap-1.5 text-left hover:text-accent"
    >
      <DisclosureChevron open={expanded} />
      <span className="min-w-0">
        <span className="block truncate font-medium">{pulse.name}</span>
        <span className="block truncate text-[11px] leading-4 text-ink-faint">{shapeNote(pulse)}</span>
      </span>
    </button>
  );
}

type Candidate = ProjectCheck["candidates"][number];

/** One candidate's cell: the verdict and the utilisation bar, the allowed current and peak T_j under them. */
function ResultCell({
  check,
  candidate: c,
  pulse,
  pending,
}: {
  check: ProjectCheck;
  candidate: Candidate;
  pulse: CheckedPulse;
  pending: boolean;
}) {
  const result = check.results[c.partId]?.[pulse.id];
  return (
    <>
      <span className="flex items-center justify-between gap-2">
        {pending ? (
          <span className="text-xs text-ink-muted">being rechecked…</span>
        ) : (
          <VerdictBadge verdict={result?.verdict ?? "no-data"} />
        )}
        {result ? (
          <UtilisationBar
            utilisation={result.utilisation}
            limit={check.policy.utilisationLimit}
            verdict={result.verdict}
          />
        ) : null}
      </span>
      <span className="num flex justify-between gap-2 text-[11px] leading-4 text-ink-muted">
        {result ? (
          <>
            <span title="Allowed current at this voltage, width and temperature">
              <Sym main="I" sub="allowed" />{" "}
              <span className="font-mono">{q(result.allowedCurrent, "A")}</span>
            </span>
            <span title="Peak junction temperature">
              <Sym main="T" sub="j" /> <span className="font-mono">{q(result.tjPeak, "°C")}</span>
            </span>
          </>
        ) : (
          <span>{pending ? "" : c.hasCurves ? "not checked" : "no SOA curves yet"}</span>
        )}
      </span>
      {result &&
      result.stability !== null &&
      (result.stabilityVerdict === "fail" || result.stabilityVerdict === "marginal") ? (
        <span
          className="num block text-[11px] leading-4 text-ink-muted"
          data-testid="result-stability"
          title="Electro-thermal stability factor: a hot spot runs away at 1"
        >
          S <span className="font-mono">{factor(result.stability)}</span>
          {result.stabilityVerdict === "fail" ? " runs away" : " near runaway"}
        </span>
      ) : null}
    </>
  );
}

function resultColumns(
  check: ProjectCheck,
  open: Set<string>,
  toggle: (id: string) => void,
): ColumnDef<CheckedPulse>[] {
  const pendingCaptures = new Set(check.pendingCaptures ?? []);
  // A capture whose job is recomputing its results: no verdict is shown until it is in.
  const isPending = (c: Candidate, pulse: CheckedPulse) =>
    !check.results[c.partId]?.[pulse.id] && c.hasCurves && pendingCaptures.has(pulse.id);
  return [
    {
      id: "pulse",
      header: "Pulse",
      size: 192,
      cell: ({ row }) => (
        <PulseName
          pulse={row.original}
          expanded={open.has(row.original.id)}
          onToggle={() => toggle(row.original.id)}
        />
      ),
      meta: { rowHeader: true, headerClassName: "min-w-48 py-1.5 align-bottom" },
    },
    ...pulseFigureColumns<CheckedPulse>(num),
    ...check.candidates.map(
      (c): ColumnDef<CheckedPulse> => ({
        id: `part-${c.partId}`,
        header: () => (
          <>
            <span className="block text-ink">{c.partNumber}</span>
            <span className="block font-normal text-ink-faint">{c.maker}</span>
          </>
        ),
        cell: ({ row }) => (
          <ResultCell check={check} candidate={c} pulse={row.original} pending={isPending(c, row.original)} />
        ),
        meta: {
          className: "border-l py-1",
          headerClassName: "border-l py-1.5 align-bottom",
          cellProps: (pulse) => ({
            "data-verdict": isPending(c, pulse)
              ? "pending"
              : (check.results[c.partId]?.[pulse.id]?.verdict ?? "no-data"),
            "data-part": c.partNumber,
          }),
        },
      }),
    ),
  ];
}

/**
 * One row per pulse and a column group per candidate: the verdict in words with its shape, the utilisation as a
 * bar, the allowed current and the peak junction temperature. A row opens to explain how each verdict was found.
 */
export function ResultsTable({ check, highlight }: { check: ProjectCheck; highlight: string | null }) {
  const [open, setOpen] = useState<Set<string>>(() => new Set(highlight ? [highlight] : []));
  const highlighted = useRef<HTMLTableRowElement | null>(null);

  useEffect(() => {
    highlighted.current?.scrollIntoView({ block: "center" });
  }, []);

  function toggle(id: string) {
    setOpen((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  }

  // The pulses grouped by where they come from, each group under its heading.
  const sections = groups.map((g) => ({ ...g, rows: check.pulses.filter((p) => p.source === g.source) }));
  const titles = new Map(
    sections.map((g) => [
      g.source as string,
      <>
        {g.title} <span className="font-normal">({g.rows.length})</span>
      </>,
    ]),
  );

  return (
    <DataTable
      label="Results: every pulse against every candidate"
      columns={resultColumns(check, open, toggle)}
      data={sections.flatMap((g) => g.rows)}
      getRowId={(pulse) => pulse.id}
      pinned={["pulse"]}
      density="tall"
      className="max-h-[min(40rem,75vh)]"
      sectionOf={(pulse) => ({ id: pulse.source, title: titles.get(pulse.source) })}
      rowProps={(pulse) => {
        const isHighlighted = pulse.id === highlight;
        return {
          ref: isHighlighted ? highlighted : undefined,
          "data-pulse-row": pulse.id,
          "data-highlighted": isHighlighted || undefined,
          className: isHighlighted ? "bg-accent-soft" : "hover:bg-surface",
        };
      }}
      detail={(pulse) => (open.has(pulse.id) ? <ResultDetails pulse={pulse} check={check} /> : null)}
      detailId={(pulse) => `explain-${pulse.id}`}
      empty="No pulses yet. Add fault cases on the Fault cases tab, or log bench measurements on the Bench tab; each is checked here against every candidate."
    />
  );
}
