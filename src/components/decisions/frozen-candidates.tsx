"use client";

import type { ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/data-table";
import { Sym } from "@/components/library/symbols";
import { money, q } from "@/lib/format";
import type { DecisionSnapshot } from "./types";

type Frozen = DecisionSnapshot["candidates"][number];

const none = (text: string) => <span className="text-ink-faint">{text}</span>;

/** A rating of the frozen part: its symbol and unit over the figure. */
function rating(
  id: "vdsMax" | "rdsOn" | "tjMax",
  main: string,
  sub: string,
  unit: "V" | "Ω" | "°C",
): ColumnDef<Frozen> {
  return {
    id,
    header: () => (
      <>
        <Sym main={main} sub={sub} />
        {` (${unit})`}
      </>
    ),
    cell: ({ row }) => q(row.original.part[id], unit),
    meta: { numeric: true },
  };
}

const columns: ColumnDef<Frozen>[] = [
  {
    id: "part",
    header: "Part",
    cell: ({ row: { original: c } }) => (
      <>
        <span className="font-medium">{c.partNumber}</span>{" "}
        <span className="text-xs text-ink-muted">{c.maker}</span>
      </>
    ),
  },
  { id: "package", header: "Package", cell: ({ row }) => row.original.part.package },
  rating("vdsMax", "V", "DSS", "V"),
  rating("rdsOn", "R", "DS(on)", "Ω"),
  rating("tjMax", "T", "j,max", "°C"),
  {
    id: "unitCost",
    header: "Unit cost",
    cell: ({ row }) => money(row.original.unitCost, row.original.currency),
    meta: { numeric: true },
  },
  {
    id: "datasheet",
    header: "Datasheet",
    cell: ({ row }) => row.original.part.datasheetRevision ?? none("—"),
  },
  {
    id: "status",
    header: "Library status",
    cell: ({ row: { original: c } }) =>
      c.status === "verified"
        ? `verified${c.verifiedByName ? ` by ${c.verifiedByName}` : ""}`
        : "draft (unverified)",
  },
  {
    id: "curveSet",
    header: "Curve set",
    cell: ({ row: { original: c } }) =>
      c.curveSetId ? (
        <span className="font-mono text-xs" title={c.curveSetId}>
          {c.curveSetId.slice(0, 8)}
        </span>
      ) : (
        none("no curves")
      ),
  },
];

/** The candidates' data as the decision froze them: ratings, datasheet revision, curve set and status. */
export function FrozenCandidates({ snapshot }: { snapshot: DecisionSnapshot }) {
  const rankOf = new Map(snapshot.ranking.map((r) => [r.partId, r.rank]));
  const candidates = [...snapshot.candidates].sort(
    (a, b) => (rankOf.get(a.partId) ?? 0) - (rankOf.get(b.partId) ?? 0),
  );
  return (
    <DataTable label="Candidates as frozen" columns={columns} data={candidates} getRowId={(c) => c.partId} />
  );
}
