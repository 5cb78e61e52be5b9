"use client";

import { Fragment, useEffect, useRef, useState } from "react";
import { Sym } from "@/components/library/symbols";
import { ScrollRegion } from "@/components/scroll-region";
import { VerdictBadge } from "@/components/verdict-shape";
import type { CheckedPulse, ProjectCheck } from "../api";
import { pulseShape, q, repeatText, shapeWords } from "../format";
import { ResultDetails } from "./result-details";
import { UtilisationBar } from "./utilisation-bar";

const groups = [
  { source: "fault-case", title: "Fault cases" },
  { source: "measured", title: "Measured pulses" },
  { source: "capture", title: "Captures" },
] as const;

const head =
  "sticky top-0 z-10 border-b border-line bg-sunken px-3 py-1.5 align-bottom text-xs font-medium whitespace-nowrap text-ink-muted";
const cell = "h-11 border-b border-line px-3 align-middle whitespace-nowrap";
const num = "num text-right font-mono text-xs";

function shapeNote(pulse: CheckedPulse): string {
  if (pulse.kind === "waveform") return `${pulseShape(pulse)}, every sample read at its own width`;
  if (pulse.kind === "avalanche") return `${shapeWords.avalanche}, energy against the avalanche rating`;
  return `${shapeWords[pulse.kind]}, ${repeatText(pulse.repeat) ?? "single pulse"}`;
}

/**
 * One row per pulse and a column group per candidate: the verdict in words with its shape, the utilisation as a
 * bar, the allowed current and the peak junction temperature. A row opens to explain how each verdict was found.
 */
export function ResultsTable({ check, highlight }: { check: ProjectCheck; highlight: string | null }) {
  const { candidates, pulses, results, policy } = check;
  const [open, setOpen] = useState<Set<string>>(() => new Set(highlight ? [highlight] : []));
  const highlighted = useRef<HTMLTableRowElement | null>(null);
  const columns = 4 + candidates.length;
  const pendingCaptures = new Set(check.pendingCaptures ?? []);

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

  return (
    <ScrollRegion className="max-h-[min(40rem,75vh)] overflow-auto rounded-md border border-line bg-panel">
      <table
        aria-label="Results: every pulse against every candidate"
        className="w-full border-separate border-spacing-0 text-sm"
      >
        <thead>
          <tr>
            <th scope="col" className={`${head} left-0 z-20 min-w-48 text-left`}>
              Pulse
            </th>
            <th scope="col" className={`${head} text-right`}>
              <Sym main="V" sub="DS" />
            </th>
            <th scope="col" className={`${head} text-right`}>
              <Sym main="I" sub="D" />
            </th>
            <th scope="col" className={`${head} text-right`}>
              Width
            </th>
            {candidates.map((c) => (
              <th key={c.partId} scope="col" className={`${head} border-l text-left`}>
                <span className="block text-ink">{c.partNumber}</span>
                <span className="block font-normal text-ink-faint">{c.maker}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {pulses.length === 0 ? (
            <tr>
              <td colSpan={columns} className="px-3 py-6 text-center text-sm text-ink-muted">
                No pulses yet. Add fault cases on the Fault cases tab, or log bench measurements on the Bench
                tab; each is checked here against every candidate.
              </td>
            </tr>
          ) : null}
          {groups.map((group) => {
            const rows = pulses.filter((p) => p.source === group.source);
            if (rows.length === 0) return null;
            return (
              <Fragment key={group.source}>
                <tr>
                  <th
                    scope="colgroup"
                    colSpan={columns}
                    className="sticky left-0 h-7 border-b border-line bg-surface px-3 text-left text-xs font-semibold text-ink-muted"
                  >
                    {group.title} <span className="font-normal">({rows.length})</span>
                  </th>
                </tr>
                {rows.map((pulse) => {
                  const expanded = open.has(pulse.id);
                  const isHighlighted = pulse.id === highlight;
                  const rowTone = isHighlighted ? "bg-accent-soft" : "bg-panel group-hover/row:bg-surface";
                  return (
                    <Fragment key={pulse.id}>
                      <tr
                        ref={isHighlighted ? highlighted : undefined}
                        data-pulse-row={pulse.id}
                        data-highlighted={isHighlighted || undefined}
                        className={`group/row ${isHighlighted ? "bg-accent-soft" : "hover:bg-surface"}`}
                      >
                        <th
                          scope="row"
                          className={`${cell} sticky left-0 z-[5] text-left font-normal ${rowTone}`}
                        >
                          <button
                            type="button"
                            aria-expanded={expanded}
                            aria-controls={`explain-${pulse.id}`}
                            onClick={() => toggle(pulse.id)}
                            className="inline-flex max-w-60 items-center gap-1.5 text-left hover:text-accent"
                          >
                            <svg
                              width="10"
                              height="10"
                              viewBox="0 0 10 10"
                              aria-hidden="true"
                              className={`shrink-0 text-ink-faint transition-transform ${expanded ? "rotate-90" : ""}`}
                            >
                              <path
                                d="M3 1.5 6.5 5 3 8.5"
                                fill="none"
                                stroke="currentColor"
                                strokeWidth="1.4"
                              />
                            </svg>
                            <span className="min-w-0">
                              <span className="block truncate font-medium">{pulse.name}</span>
                              <span className="block truncate text-[11px] leading-4 text-ink-faint">
                                {shapeNote(pulse)}
                              </span>
                            </span>
                          </button>
                        </th>
                        <td className={`${cell} ${num}`}>{q(pulse.v, "V")}</td>
                        <td className={`${cell} ${num}`}>{q(pulse.i, "A")}</td>
                        <td className={`${cell} ${num}`}>{q(pulse.duration, "s")}</td>
                        {candidates.map((c) => {
                          const result = results[c.partId]?.[pulse.id];
                          // A capture whose job is recomputing its results: no verdict is shown until it is in.
                          const pending = !result && c.hasCurves && pendingCaptures.has(pulse.id);
                          return (
                            <td
                              key={c.partId}
                              className={`${cell} border-l py-1`}
                              data-verdict={pending ? "pending" : (result?.verdict ?? "no-data")}
                              data-part={c.partNumber}
                            >
                              <span className="flex items-center justify-between gap-2">
                                {pending ? (
                                  <span className="text-xs text-ink-muted">being rechecked…</span>
                                ) : (
                                  <VerdictBadge verdict={result?.verdict ?? "no-data"} />
                                )}
                                {result ? (
                                  <UtilisationBar
                                    utilisation={result.utilisation}
                                    limit={policy.utilisationLimit}
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
                                      <Sym main="T" sub="j" />{" "}
                                      <span className="font-mono">{q(result.tjPeak, "°C")}</span>
                                    </span>
                                  </>
                                ) : (
                                  <span>
                                    {pending ? "" : c.hasCurves ? "not checked" : "no SOA curves yet"}
                                  </span>
                                )}
                              </span>
                              {result &&
                              result.stability !== null &&
                              (result.stabilityVerdict === "fail" ||
                                result.stabilityVerdict === "marginal") ? (
                                <span
                                  className="num block text-[11px] leading-4 text-ink-muted"
                                  data-testid="result-stability"
                                  title="Electro-thermal stability factor: a hot spot runs away at 1"
                                >
                                  S <span className="font-mono">{result.stability.toFixed(2)}</span>
                                  {result.stabilityVerdict === "fail" ? " runs away" : " near runaway"}
                                </span>
                              ) : null}
                            </td>
                          );
                        })}
                      </tr>
                      {expanded ? (
                        <tr id={`explain-${pulse.id}`}>
                          <td colSpan={columns} className="border-b border-line bg-surface px-3 py-3">
                            <ResultDetails pulse={pulse} check={check} />
                          </td>
                        </tr>
                      ) : null}
                    </Fragment>
                  );
                })}
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
