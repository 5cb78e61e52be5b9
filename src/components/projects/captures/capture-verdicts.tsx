import { Caution } from "@/components/caution";
import { Sym } from "@/components/library/symbols";
import { Table, Td, Th, Tr } from "@/components/table";
import { VerdictBadge } from "@/components/verdict-shape";
import { explainFlag } from "@/lib/soa/explain";
import type { PulseResult } from "@/lib/soa/types";
import { q } from "../format";
import { UtilisationBar } from "../results/utilisation-bar";
import type { CaptureDetail } from "./capture-api";
import type { VerdictOf } from "./capture-traces";

type Candidate = CaptureDetail["candidates"][number];

function startWords(start: "rest" | "steady" | null): string {
  if (start === "rest") return "rest (as stated at upload)";
  if (start === "steady") return "the first sample's level, settled (as stated at upload)";
  return "rest, or from the first sample's level where the record begins mid-pulse";
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
      <Table label={`Verdicts for ${capture.name}`}>
        <thead>
          <tr>
            <Th>Candidate</Th>
            <Th>Verdict</Th>
            <Th numeric>Utilisation</Th>
            <Th numeric>
              Allowed <Sym main="I" sub="D" />
            </Th>
            <Th numeric>
              <Sym main="T" sub="j,peak" />
            </Th>
            <Th>Binding sample</Th>
            <Th>How it was read</Th>
          </tr>
        </thead>
        <tbody>
          {candidates.map((c) => (
            <VerdictRow
              key={c.partId}
              candidate={c}
              result={verdictOf(c.partId)}
              utilisationLimit={utilisationLimit}
            />
          ))}
        </tbody>
      </Table>
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

function VerdictRow({
  candidate: c,
  result,
  utilisationLimit,
}: {
  candidate: Candidate;
  /** Undefined while it is being rechecked. */
  result: PulseResult | null | undefined;
  utilisationLimit: number;
}) {
  return (
    <Tr>
      <Td className="font-medium">{c.partNumber}</Td>
      <Td data-verdict={result?.verdict ?? "no-data"}>
        {result === undefined ? (
          <span className="text-ink-faint">being rechecked…</span>
        ) : (
          <VerdictBadge verdict={result?.verdict ?? "no-data"} />
        )}
      </Td>
      <Td className="text-right">
        {result ? (
          <UtilisationBar
            utilisation={result.utilisation}
            limit={utilisationLimit}
            verdict={result.verdict}
          />
        ) : (
          "—"
        )}
      </Td>
      <Td numeric>{q(result?.allowedCurrent, "A")}</Td>
      <Td numeric>
        {q(result?.tjPeak ?? c.junction?.tjPeak, "°C")}
        {c.junction ? <span className="text-ink-faint"> / {q(c.tjMax, "°C")}</span> : null}
      </Td>
      <Td className="text-xs whitespace-nowrap" data-testid="binding-cell">
        {result?.at ? (
          <>
            <span className="num font-mono">
              {q(result.at.v, "V")} × {q(result.at.i, "A")}
            </span>
            <span className="block text-ink-faint">
              at {q(result.at.t, "s")}, read at{" "}
              {result.at.width === null ? "unlimited width" : q(result.at.width, "s")}
            </span>
          </>
        ) : (
          "—"
        )}
      </Td>
      <Td className="max-w-md py-1.5 text-xs whitespace-normal text-ink-muted">
        {result?.flags.length ? (
          <ul className="min-w-72 space-y-0.5 whitespace-normal">
            {result.flags.map((f) => (
              <li key={f}>{explainFlag(f)}</li>
            ))}
          </ul>
        ) : (
          "—"
        )}
      </Td>
    </Tr>
  );
}
