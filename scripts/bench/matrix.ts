// Matrix benchmark: 50 synthetic parts × 1 000 pulses through runCheck, as the candidates × fault cases view
// and the bench API would run it. Figures are printed, never asserted. Target: ≤ 100 ms for the whole matrix.
import { runCheck } from "../../src/lib/soa/check";
import type { FosterTerm } from "../../src/lib/soa/foster";
import type { CheckRequest, Curve, Pulse } from "../../src/lib/soa/types";

const PARTS = 50;
const PULSES = 1000;
const RUNS = 7;
const WIDTHS = [10e-6, 100e-6, 1e-3, 10e-3];

/** Small deterministic generator (mulberry32) so that every run checks the same matrix. */
function random(start: number): () => number {
  let a = start >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * A part from a simple physical picture: R_DS(on) line, package limit, thermal limit P(t)/V from a Foster
 * network.
 */
function syntheticPart(rand: () => number, withFoster: boolean): CheckRequest["part"] {
  const vdsMax = [40, 60, 80, 100, 150][Math.floor(rand() * 5)];
  const rdsOn = 1e-3 * (1 + 9 * rand());
  const iPackage = 100 + 300 * rand();
  const foster: FosterTerm[] = [
    { r: 0.02 + 0.05 * rand(), tau: 1e-5 * (1 + rand()) },
    { r: 0.1 + 0.2 * rand(), tau: 1e-3 * (1 + rand()) },
    { r: 0.2 + 0.4 * rand(), tau: 5e-2 * (1 + rand()) },
  ];
  const zth = (t: number) => foster.reduce((z, { r, tau }) => z - r * Math.expm1(-t / tau), 0);
  const rth = foster.reduce((s, { r }) => s + r, 0);
  const voltages = Array.from({ length: 8 }, (_, k) => 0.5 * (vdsMax / 0.5) ** (k / 7));
  const curve = (duration: number | "DC"): Curve => {
    const power = 150 / (duration === "DC" ? rth : zth(duration));
    return {
      duration,
      points: voltages.map((v) => [v, Math.min(v / rdsOn, iPackage, power / v)] as [number, number]),
    };
  };
  return {
    vdsMax,
    tjMax: 175,
    rdsOn,
    idPulseMax: iPackage,
    ...(withFoster ? { foster } : { rthJc: rth }),
    soa: { curves: [...WIDTHS.map(curve), curve("DC")] },
  };
}

function syntheticPulses(rand: () => number, vdsMax: number): Pulse[] {
  return Array.from({ length: PULSES }, (_, k): Pulse => {
    const v = vdsMax * (0.05 + 0.9 * rand());
    const i = 1 + 60 * rand();
    const duration = 10 ** (-5.5 + 4 * rand());
    const id = `p${k}`;
    const roll = rand();
    if (roll < 0.5) return { id, kind: "rect", v, i, duration };
    if (roll < 0.8) return { id, kind: "triangle", v, i, duration };
    const repeat = {
      period: duration * (2 + 50 * rand()),
      ...(rand() < 0.5 ? { count: 1 + Math.floor(10 * rand()) } : {}),
    };
    return rand() < 0.5
      ? { id, kind: "rect", v, i, duration, repeat }
      : { id, kind: "triangle", v, i, duration, repeat };
  });
}

export function buildMatrix(): CheckRequest[] {
  const rand = random(20240611);
  return Array.from({ length: PARTS }, (_, p) => {
    const part = syntheticPart(rand, p % 5 === 0);
    return { part, caseTemp: 60 + 40 * rand(), pulses: syntheticPulses(rand, part.vdsMax) };
  });
}

export function runMatrixBench(): void {
  const matrix = buildMatrix();
  const checks = PARTS * PULSES;
  let best = Number.POSITIVE_INFINITY;
  let verdicts = 0;
  for (let run = 0; run < RUNS; run++) {
    const start = performance.now();
    for (const request of matrix) verdicts += runCheck(request).results.length;
    best = Math.min(best, performance.now() - start);
  }
  const perSecond = Math.round(checks / (best / 1000));
  console.log(
    `matrix: ${PARTS} parts × ${PULSES} pulses = ${checks} checks, best of ${RUNS}: ${best.toFixed(1)} ms ` +
      `(${perSecond.toLocaleString("en")} checks/s; ${verdicts / RUNS} results per run; ` +
      "1 in 5 parts with a Foster network)",
  );
}
