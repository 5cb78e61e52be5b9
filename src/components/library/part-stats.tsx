import type { ReactNode } from "react";
import { DateText } from "@/components/date-text";
import { StatBlock } from "@/components/stat-blocks";
import { q } from "@/lib/format";
import { PartStatus } from "./part-status";
import { Sym } from "./symbols";

export interface PartFigures {
  vdsMax: number;
  idPulseMax: number | null;
  rdsOn: number | null;
  tjMax: number;
  rthJc: number | null;
  avalancheEnergy?: number | null;
  avalancheBreakdown?: number | null;
  status: "draft" | "verified";
  verifiedByName: string | null;
  verifiedAt: Date | string | null;
}

function Stat(props: { label: ReactNode; value: ReactNode; note?: ReactNode }) {
  return <StatBlock {...props} numeric />;
}

/** The part's key figures, and who verified it when. */
export function PartStats({ part }: { part: PartFigures }) {
  return (
    <dl className="grid grid-cols-[repeat(auto-fill,minmax(9.5rem,1fr))] gap-3" aria-label="Key figures">
      <Stat label={<Sym main="V" sub="DSS" />} value={q(part.vdsMax, "V")} />
      <Stat label={<Sym main="I" sub="DM" />} value={q(part.idPulseMax, "A")} note="pulsed" />
      <Stat label={<Sym main="R" sub="DS(on)" />} value={q(part.rdsOn, "Ω")} note="at 25 °C" />
      <Stat label={<Sym main="T" sub="j,max" />} value={q(part.tjMax, "°C")} />
      <Stat label={<Sym main="R" sub="th(j-c)" />} value={q(part.rthJc, "K/W")} />
      {part.avalancheEnergy ? (
        <Stat
          label={<Sym main="E" sub="AS" />}
          value={q(part.avalancheEnergy, "J")}
          note={part.avalancheBreakdown ? `V_BR ${q(part.avalancheBreakdown, "V")}` : "from 25 °C"}
        />
      ) : null}
      <div className="rounded-md border border-line bg-panel px-4 py-3" data-testid="part-status">
        <dt className="text-xs text-ink-muted">Status</dt>
        <dd className="mt-1 leading-7">
          <PartStatus status={part.status} />
        </dd>
        <dd className="text-xs text-ink-faint">
          {part.status === "verified" && part.verifiedAt ? (
            <>
              Verified by {part.verifiedByName ?? "a former member"} on <DateText value={part.verifiedAt} />
            </>
          ) : (
            "Not yet checked by a lead"
          )}
        </dd>
      </div>
    </dl>
  );
}
