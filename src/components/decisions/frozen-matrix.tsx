"use client";

import { useState } from "react";
import { SelectedCellDetails } from "./cell-details";
import { type CellRef, MatrixTable } from "./matrix-table";
import type { MatrixData, MatrixRow } from "./types";

/** A decision's matrix exactly as frozen, in its frozen rank order; a cell opens how it was found then. */
export function FrozenMatrix({ data, ranking }: { data: MatrixData; ranking: MatrixRow[] }) {
  const [selected, setSelected] = useState<CellRef | null>(null);
  return (
    <>
      <MatrixTable
        label="Frozen matrix"
        data={data}
        ranking={ranking}
        pulses={data.pulses}
        selected={selected}
        onSelect={setSelected}
      />
      <SelectedCellDetails data={data} selected={selected} onClose={() => setSelected(null)} />
    </>
  );
}
