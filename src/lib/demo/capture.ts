import type { CaptureMapping } from "@/lib/capture/parse";
import { inrushPulses } from "@/lib/soa/builders";

// The demo project's scope capture (invented): the pre-charge ramp into the motor controller's capacitors with
// its idle load, as the bench scope would export it. Built from the inrush circuit model (METHODS.md §11, with a
// resistive load), with a quiet stretch before and after and a little deterministic probe noise.

export const demoCaptureName = "Pre-charge ramp with controller idle load, board TW-03";
export const demoCaptureFileName = "TW-03-precharge.csv";

/** How the demo capture's columns read: two preamble rows, a header, then time, V_DS and I_D in SI units. */
export const demoCaptureMapping: CaptureMapping = {
  skipRows: 2,
  header: true,
  time: 0,
  voltage: 1,
  current: 2,
  timeScale: 1,
  vScale: 1,
  vOffset: 0,
  iScale: 1,
  iOffset: 0,
};

/** Deterministic noise in [−1, 1] (a linear congruential sequence), so the demo is the same every time. */
function noise(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 31 - 1;
  };
}

export function demoCaptureCsv(): string {
  const model = inrushPulses({ capacitance: 1.5e-3, slew: 1000, supply: 48, load: 40, samples: 12_001 });
  if (!model.ok || model.pulses[0].kind !== "waveform") throw new Error("the inrush model gave no waveform");
  const { t, v, i } = model.pulses[0];
  const dt = t[1] - t[0];
  const pre = 400;
  const post = 800;
  const rand = noise(7);
  const lines = [
    "Instrument,Bench scope (demo export)",
    `Sample interval,${dt}`,
    "Time (s),CH1 V_DS (V),CH2 I_D (A)",
  ];
  const row = (time: number, volts: number, amps: number) =>
    lines.push(
      `${time.toExponential(6)},${(volts + 0.02 * rand()).toFixed(4)},${(amps + 0.01 * rand()).toFixed(4)}`,
    );
  // Before the ramp the switch blocks the full pack voltage and carries nothing; after it, it is fully on.
  for (let k = pre; k > 0; k--) row(-k * dt, 48, 0);
  for (let k = 0; k < t.length; k++) row(t[k], v[k], i[k]);
  const tEnd = t[t.length - 1];
  const onCurrent = 48 / 40;
  for (let k = 1; k <= post; k++) row(tEnd + k * dt, onCurrent * 0.003, onCurrent);
  return `${lines.join("\n")}\n`;
}
