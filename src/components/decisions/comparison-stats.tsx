import Link from "next/link";
import { StatBlocks } from "@/components/stat-blocks";
import { money, percent, plural } from "@/lib/format";
import type { MatrixRow } from "@/lib/projects/matrix";
import { bestPassing, pulseCounts } from "./matrix-model";
import { policyStat } from "./policy-stat";
import { useDecisions } from "./queries";
import type { DecisionSummary, ProjectCheck } from "./types";

/** The comparison's key figures: candidates, pulses, the best that passes all, the policy, the standing decision. */
export function ComparisonStats({
  projectId,
  check,
  ranking,
}: {
  projectId: string;
  check: ProjectCheck;
  ranking: MatrixRow[];
}) {
  const decisions = useDecisions(projectId);
  const counts = pulseCounts(check.pulses);
  const best = bestPassing(ranking);
  const bestCandidate = check.candidates.find((c) => c.partId === best);
  const bestRow = ranking.find((r) => r.partId === best);
  const passing = ranking.filter((r) => r.passesAll).length;
  return (
    <StatBlocks
      items={[
        {
          label: "Candidates",
          value: check.candidates.length,
          note: `${passing} pass every pulse`,
        },
        {
          label: "Pulses",
          value: check.pulses.length,
          note: `${plural(counts.faultCases, "fault case")} · ${counts.measured} measured · ${plural(counts.captures, "capture")}`,
        },
        {
          label: "Best that passes all",
          value: bestCandidate ? bestCandidate.partNumber : "none",
          note: bestRow
            ? `worst utilisation ${percent(bestRow.worstUtilisation)} · ${money(bestCandidate!.unitCost, bestCandidate!.currency)}`
            : "every candidate has a marginal, fail or no data",
        },
        policyStat(check.policy),
        standingItem(projectId, check, decisions.data?.decisions, decisions.isPending),
      ]}
    />
  );
}

/** The stat block of the standing decision: its part, who signed it and when, linking to the record. */
function standingItem(
  projectId: string,
  check: ProjectCheck,
  decisions: DecisionSummary[] | undefined,
  pending: boolean,
) {
  const label = "Standing decision";
  if (pending) return { label, value: <span className="text-ink-faint">…</span> };
  const standing = decisions?.find((d) => d.supersededBy === null);
  if (!standing) {
    return {
      label,
      value: <span className="text-ink-muted">none yet</span>,
      note: (
        <Link href={`/projects/${projectId}/decisions`} className="hover:text-accent hover:underline">
          {decisions?.length ? "see the history" : "no decision recorded"}
        </Link>
      ),
    };
  }
  const part = check.candidates.find((c) => c.partId === standing.chosenPartId);
  return {
    label,
    value: (
      <Link
        href={`/projects/${projectId}/decisions/${standing.id}`}
        className="block truncate hover:text-accent hover:underline"
        title={standing.chosenLabel}
      >
        {part?.partNumber ?? standing.chosenLabel}
      </Link>
    ),
    note: `${standing.signedByName}, ${standing.signedAt.slice(0, 10)}`,
  };
}
