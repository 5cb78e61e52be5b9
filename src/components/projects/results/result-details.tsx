import { Sym } from "@/components/library/symbols";
import { VerdictBadge } from "@/components/verdict-shape";
import { factor, percent, q, repeatText, settingPercent } from "@/lib/format";
import { curvesRead, decidingViews, explainFlag, VERDICT_EXPLANATIONS, VIEW_WORDS } from "@/lib/soa/explain";
import type { PulseResult, Verdict } from "@/lib/soa/types";
import { pulseShape, sourceWords } from "@/lib/vocabulary";
import type { CheckedPulse, ProjectCheck } from "../api";

/** The pulse as the check read it, in one sentence. */
function pulseSentence(pulse: CheckedPulse, projectCaseTemp: number): string {
  const parts = [
    `${sourceWords[pulse.source]}, ${pulseShape(pulse)}`,
    pulse.kind === "waveform"
      ? `every sample read at its own width; peak power at ${q(pulse.v, "V")} × ${q(pulse.i, "A")}, equal-energy width ${q(pulse.duration, "s")}`
      : pulse.kind === "avalanche"
        ? "the drain rises to each candidate's breakdown voltage and the energy is read against its avalanche rating, derated for the starting temperature"
        : `${q(pulse.v, "V")}, ${q(pulse.i, "A")}${pulse.kind === "triangle" ? " peak" : ""} for ${q(pulse.duration, "s")}`,
    pulse.kind === "avalanche" ? "single event" : (repeatText(pulse.repeat) ?? "single pulse"),
    `checked at ${q(pulse.caseTemp, "°C")} case${pulse.caseTemp !== projectCaseTemp ? " (the fault case's own temperature)" : ""}`,
  ];
  return `${parts.join("; ")}.`;
}

const viewVerdict = (verdict: Verdict | null, missing: string) =>
  verdict === null ? (
    <span className="font-sans text-ink-faint">{missing}</span>
  ) : (
    <VerdictBadge verdict={verdict} />
  );

/** The allowed current as read on the curves, before derating and the repetition scale. */
function readingBefore(result: PulseResult): number | null {
  if (result.allowedCurrent === null || !(result.derating > 0)) return null;
  return result.allowedCurrent / result.derating / (result.repetitionScale ?? 1);
}

/** Which curves the binding reading used, in words. */
function readFrom(
  candidate: ProjectCheck["candidates"][number],
  result: PulseResult,
  policy: ProjectCheck["policy"]["betweenCurves"],
): string | null {
  const width = result.at ? result.at.width : result.equivalentWidth;
  return curvesRead(candidate.widths ?? [], width, policy, candidate.hasThermalModel);
}

/** How every candidate's verdict for one pulse was found: the figures, the derating, and each flag in words. */
export function ResultDetails({ pulse, check }: { pulse: CheckedPulse; check: ProjectCheck }) {
  const { policy } = check;
  return (
    <div className="sticky left-3 max-w-5xl space-y-3 text-sm whitespace-normal" data-testid="result-details">
      <p className="text-ink-muted">{pulseSentence(pulse, policy.caseTemp)}</p>
      <ul className="grid gap-3 md:grid-cols-2 xl:grid-cols-3">
        {check.candidates.map((c) => {
          const result = check.results[c.partId]?.[pulse.id];
          return (
            <li key={c.partId} className="rounded-md border border-line bg-panel p-3">
              <p className="flex items-baseline justify-between gap-2">
                <span className="font-medium">{c.partNumber}</span>
                <VerdictBadge verdict={result?.verdict ?? "no-data"} />
              </p>
              {!result ? (
                <p className="mt-1 text-ink-muted">
                  This part has no SOA curves yet, so nothing can be said about the pulse. An engineer uploads
                  them on the part&apos;s library page.
                </p>
              ) : (
                <>
                  <p className="mt-1 text-ink-muted">{VERDICT_EXPLANATIONS[result.verdict]}</p>
                  <p className="mt-1 text-xs" data-testid="decided-by">
                    Decided by{" "}
                    {decidingViews(result)
                      .map((view) => VIEW_WORDS[view])
                      .join(" and ")}
                    .
                  </p>
                  <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
                    <dt className="text-ink-muted">Curves</dt>
                    <dd>{viewVerdict(result.curveVerdict, "")}</dd>
                    <dt className="text-ink-muted">Thermal</dt>
                    <dd>{viewVerdict(result.thermalVerdict, "no thermal model")}</dd>
                    <dt className="text-ink-muted">Stability</dt>
                    <dd>{viewVerdict(result.stabilityVerdict, "not checked (needs transfer data)")}</dd>
                    {result.stability !== null ? (
                      <>
                        <dt className="text-ink-muted">Stability factor</dt>
                        <dd className="num font-mono" data-testid="stability-factor">
                          S = {factor(result.stability)}{" "}
                          <span className="font-sans text-ink-faint">
                            (runs away at 1; limit {settingPercent(policy.utilisationLimit)})
                          </span>
                        </dd>
                      </>
                    ) : null}
                    <dt className="text-ink-muted">Width read</dt>
                    <dd className="num font-mono">
                      {q(result.equivalentWidth, "s")}
                      {pulse.kind !== "rect" ? (
                        <span className="font-sans text-ink-faint"> (equal energy at peak power)</span>
                      ) : null}
                    </dd>
                    {result.at ? (
                      <>
                        <dt className="text-ink-muted">Binding sample</dt>
                        <dd className="num font-mono" data-testid="binding-sample">
                          t = {q(result.at.t, "s")}: {q(result.at.v, "V")}, {q(result.at.i, "A")}, read at{" "}
                          {result.at.width === null ? "unlimited width (DC)" : q(result.at.width, "s")}
                        </dd>
                      </>
                    ) : null}
                    <dt className="text-ink-muted">On the curves</dt>
                    <dd className="num font-mono">
                      {q(readingBefore(result), "A")}{" "}
                      <span className="font-sans text-ink-faint">
                        before derating
                        {readFrom(c, result, policy.betweenCurves)
                          ? `, from ${readFrom(c, result, policy.betweenCurves)}`
                          : ""}
                      </span>
                    </dd>
                    {result.repetitionScale !== null ? (
                      <>
                        <dt className="text-ink-muted">Repetition</dt>
                        <dd className="num font-mono">×{factor(result.repetitionScale)}</dd>
                      </>
                    ) : null}
                    <dt className="text-ink-muted">
                      Allowed <Sym main="I" sub="D" />
                    </dt>
                    <dd className="num font-mono">{q(result.allowedCurrent, "A")}</dd>
                    <dt className="text-ink-muted">Utilisation</dt>
                    <dd className="num font-mono">
                      {percent(result.utilisation)}{" "}
                      <span className="font-sans text-ink-faint">
                        (limit {settingPercent(policy.utilisationLimit)})
                      </span>
                    </dd>
                    <dt className="text-ink-muted">Derating</dt>
                    <dd className="num font-mono">
                      ×{factor(result.derating)}{" "}
                      <span className="font-sans text-ink-faint">for {q(pulse.caseTemp, "°C")} case</span>
                    </dd>
                    <dt className="text-ink-muted">
                      <Sym main="T" sub="j,peak" />
                    </dt>
                    <dd className="num font-mono">
                      {result.tjPeak === null ? (
                        <span className="font-sans text-ink-faint">
                          no thermal model: the curves alone decide
                        </span>
                      ) : (
                        <>
                          {q(result.tjPeak, "°C")}{" "}
                          <span className="font-sans text-ink-faint">(guard {policy.tjGuard} K)</span>
                        </>
                      )}
                    </dd>
                  </dl>
                  {result.flags.length ? (
                    <ul
                      className="mt-2 list-disc space-y-1 pl-4 text-xs text-ink-muted"
                      aria-label="How it was read"
                    >
                      {result.flags.map((flag) => (
                        <li key={flag}>{explainFlag(flag)}</li>
                      ))}
                    </ul>
                  ) : null}
                </>
              )}
            </li>
          );
        })}
      </ul>
    </div>
  );
}
