import type { ColumnDef, ColumnMeta } from "@tanstack/react-table";
import { Sym } from "@/components/library/symbols";
import { q } from "@/lib/format";

interface PulseFigures {
  v: number | null;
  i: number | null;
  duration: number | null;
}

/** The V_DS, I_D and width columns of a table of pulses, each with the table's meta for figures. */
export function pulseFigureColumns<T extends PulseFigures>(meta: ColumnMeta<T, unknown>): ColumnDef<T>[] {
  return [
    { id: "v", header: () => <Sym main="V" sub="DS" />, cell: ({ row }) => q(row.original.v, "V"), meta },
    { id: "i", header: () => <Sym main="I" sub="D" />, cell: ({ row }) => q(row.original.i, "A"), meta },
    { id: "width", header: "Width", cell: ({ row }) => q(row.original.duration, "s"), meta },
  ];
}
