import { Sym } from "@/components/library/symbols";
import { LoadingBox } from "@/components/loading-box";
import { StatBlocks } from "@/components/stat-blocks";
import { count, kelvin, plural, q, settingPercent } from "@/lib/format";
import type { ProjectCheck, ProjectDetail } from "./api";

function Figure({ children }: { children: string }) {
  return <span className="num font-mono">{children}</span>;
}

/** The project's key figures: temperature, margin policy, and how many candidates and pulses it holds. */
export function ProjectStats({ detail, check }: { detail?: ProjectDetail; check?: ProjectCheck }) {
  if (!detail) {
    return <LoadingBox className="h-[4.75rem]">Loading the figures of the project…</LoadingBox>;
  }
  const { project, candidates, faultCases, measuredPulses } = detail;
  const captures = check?.pulses.filter((p) => p.source === "capture").length ?? 0;
  const pulses = faultCases.length + measuredPulses.length + captures;
  const withModel = candidates.filter((c) => c.part.foster?.length).length;
  return (
    <StatBlocks
      items={[
        {
          label: "Case temperature",
          value: <Figure>{q(project.caseTemp, "°C")}</Figure>,
          note: "unless a fault case overrides it",
        },
        {
          label: "Utilisation limit",
          value: <Figure>{settingPercent(project.utilisationLimit)}</Figure>,
          note: "of the allowed current",
        },
        {
          label: "Junction guard",
          value: <Figure>{kelvin(project.tjGuard)}</Figure>,
          note: (
            <>
              below <Sym main="T" sub="j,max" />, with a thermal model
            </>
          ),
        },
        {
          label: "Candidates",
          value: <Figure>{count(candidates.length)}</Figure>,
          note: `${withModel} with a thermal model`,
        },
        {
          label: "Pulses",
          value: <Figure>{count(pulses)}</Figure>,
          note: `${plural(faultCases.length, "fault case")} · ${measuredPulses.length} measured · ${plural(captures, "capture")}`,
        },
      ]}
    />
  );
}
