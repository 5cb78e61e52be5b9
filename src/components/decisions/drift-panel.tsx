import { q, settingPercent } from "@/lib/format";
import { DriftResults } from "./drift-results";
import type { DecisionSnapshot, Drift } from "./types";

type Policy = DecisionSnapshot["policy"];

const betweenWords = {
  loglog: "log-log interpolation",
  "next-longer": "next longer curve",
  thermal: "shorter curve scaled by the thermal model",
} as const;

function policyText(p: Policy): string {
  const voltage =
    p.voltageLimit === undefined ? "" : `, voltage limit ${settingPercent(p.voltageLimit)} of V_DSS`;
  return `utilisation limit ${settingPercent(p.utilisationLimit)}, Tj guard ${q(p.tjGuard, "")}\u2009K${voltage}, between curves: ${betweenWords[p.betweenCurves]}`;
}

/** True when checking again would give exactly what was frozen. */
function driftIsEmpty(drift: Drift): boolean {
  return (
    drift.methodsChanged === null &&
    !drift.policyChanged &&
    drift.caseTempChanged === null &&
    drift.curveSetsChanged.length === 0 &&
    drift.pulsesAdded.length === 0 &&
    drift.pulsesRemoved.length === 0 &&
    drift.results.length === 0
  );
}

/**
 * "Checked again now": what differs between the frozen evaluation and the project checked today. The record
 * itself never changes; this only says how far the world has moved from it.
 */
export function DriftPanel({ drift, frozen, now }: { drift: Drift; frozen: Policy; now: Policy }) {
  if (driftIsEmpty(drift)) {
    return (
      <p
        className="rounded-md border border-line border-l-2 border-l-pass bg-panel px-4 py-3 text-sm"
        data-testid="drift"
      >
        Nothing has changed since the decision: checked again now, every candidate and pulse gives the frozen
        result.
      </p>
    );
  }
  const changes: { key: string; what: string; detail: string }[] = [];
  if (drift.methodsChanged) {
    changes.push({
      key: "methods",
      what: "Methods",
      detail:
        `revision ${drift.methodsChanged.frozen} → ${drift.methodsChanged.now}: the rules of the check changed, so ` +
        "verdicts below may differ for that reason alone, with nothing else changed",
    });
  }
  if (drift.caseTempChanged) {
    changes.push({
      key: "temp",
      what: "Case temperature",
      detail: `${q(drift.caseTempChanged.frozen, "°C")} → ${q(drift.caseTempChanged.now, "°C")}`,
    });
  }
  if (drift.policyChanged) {
    changes.push({
      key: "policy",
      what: "Margin policy",
      detail: `${policyText(frozen)} → ${policyText(now)}`,
    });
  }
  for (const c of drift.curveSetsChanged) {
    changes.push({
      key: `curves-${c.partId}`,
      what: "Part data",
      detail: `${c.label}: its SOA curves or ratings differ from those frozen`,
    });
  }
  if (drift.pulsesAdded.length) {
    changes.push({ key: "added", what: "Pulses added", detail: drift.pulsesAdded.join(", ") });
  }
  if (drift.pulsesRemoved.length) {
    changes.push({ key: "removed", what: "Pulses removed", detail: drift.pulsesRemoved.join(", ") });
  }
  return (
    <div
      className="space-y-3 rounded-md border border-line border-l-2 border-l-marginal bg-panel p-4"
      data-testid="drift"
    >
      <p className="text-sm">
        Checked again now, the project differs from the frozen evaluation. The record and its report stay as
        signed.
      </p>
      {changes.length ? (
        <dl className="grid gap-x-6 gap-y-1.5 text-sm sm:grid-cols-[max-content_1fr]">
          {changes.map((c) => (
            <div key={c.key} className="contents">
              <dt className="text-ink-muted">{c.what}</dt>
              <dd>{c.detail}</dd>
            </div>
          ))}
        </dl>
      ) : null}
      {drift.results.length ? <DriftResults results={drift.results} /> : null}
    </div>
  );
}
