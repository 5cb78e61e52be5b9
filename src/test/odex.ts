import { createRequire } from "node:module";

// The general-purpose ODE integrator the thermal tests check against: odex, E. Hairer's ODEX extrapolation
// solver. It ships its TypeScript source rather than declarations, and that source fails this project's strict
// type check, so it is loaded untyped and the part the tests use is described here.
export interface OdexSolver {
  relativeTolerance: number;
  absoluteTolerance: number;
  maxSteps: number;
  denseOutput: boolean;
  solve(
    f: (x: number, y: number[]) => number[],
    x: number,
    y: number[],
    xEnd: number,
    observe?: (
      n: number,
      xOld: number,
      x: number,
      y: number[],
      dense?: (i: number, x: number) => number,
    ) => void,
  ): { y: number[] };
}

export const { Solver } = createRequire(import.meta.url)("odex") as { Solver: new (n: number) => OdexSolver };
