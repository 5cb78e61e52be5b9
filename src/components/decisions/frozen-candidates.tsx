import { Sym } from "@/components/library/symbols";
import { Table, Td, Th, Tr } from "@/components/table";
import { money, q } from "./format";
import type { DecisionSnapshot } from "./types";

/** The candidates' data as the decision froze them: ratings, datasheet revision, curve set and status. */
export function FrozenCandidates({ snapshot }: { snapshot: DecisionSnapshot }) {
  const rankOf = new Map(snapshot.ranking.map((r) => [r.partId, r.rank]));
  const candidates = [...snapshot.candidates].sort(
    (a, b) => (rankOf.get(a.partId) ?? 0) - (rankOf.get(b.partId) ?? 0),
  );
  return (
    <Table label="Candidates as frozen">
      <thead>
        <tr>
          <Th>Part</Th>
          <Th>Package</Th>
          <Th numeric>
            <Sym main="V" sub="DSS" /> (V)
          </Th>
          <Th numeric>
            <Sym main="R" sub="DS(on)" /> (Ω)
          </Th>
          <Th numeric>
            <Sym main="T" sub="j,max" /> (°C)
          </Th>
          <Th numeric>Unit cost</Th>
          <Th>Datasheet</Th>
          <Th>Library status</Th>
          <Th>Curve set</Th>
        </tr>
      </thead>
      <tbody>
        {candidates.map((c) => (
          <Tr key={c.partId}>
            <Td>
              <span className="font-medium">{c.partNumber}</span>{" "}
              <span className="text-xs text-ink-muted">{c.maker}</span>
            </Td>
            <Td>{c.part.package}</Td>
            <Td numeric>{q(c.part.vdsMax, "V")}</Td>
            <Td numeric>{q(c.part.rdsOn, "Ω")}</Td>
            <Td numeric>{q(c.part.tjMax, "°C")}</Td>
            <Td numeric>{money(c.unitCost, c.currency)}</Td>
            <Td>{c.part.datasheetRevision ?? <span className="text-ink-faint">—</span>}</Td>
            <Td>
              {c.status === "verified"
                ? `verified${c.verifiedByName ? ` by ${c.verifiedByName}` : ""}`
                : "draft (unverified)"}
            </Td>
            <Td>
              {c.curveSetId ? (
                <span className="font-mono text-xs" title={c.curveSetId}>
                  {c.curveSetId.slice(0, 8)}
                </span>
              ) : (
                <span className="text-ink-faint">no curves</span>
              )}
            </Td>
          </Tr>
        ))}
      </tbody>
    </Table>
  );
}
