import type { ReactNode } from "react";

/** A trade symbol set properly: V<sub>DSS</sub>, R<sub>DS(on)</sub>, T<sub>j,max</sub>. */
export function Sym({ main, sub }: { main: string; sub: string }) {
  return (
    <>
      {main}
      <sub>{sub}</sub>
    </>
  );
}

export const symbols: Record<string, ReactNode> = {
  vdsMax: <Sym main="V" sub="DSS" />,
  idMax: <Sym main="I" sub="D" />,
  idPulseMax: <Sym main="I" sub="DM" />,
  rdsOn: <Sym main="R" sub="DS(on)" />,
  tjMax: <Sym main="T" sub="j,max" />,
  rthJc: <Sym main="R" sub="th(j-c)" />,
  caseTemp: <Sym main="T" sub="C" />,
  zth: <Sym main="Z" sub="th" />,
};
