import { describe, expect, it } from "vitest";
import { Solver } from "@/test/odex";
import { unclampedTurnOff } from "./builders";
import type { FosterTerm } from "./foster";
import { faultSequence, type SequenceInput } from "./sequence";
import { rectRise } from "./thermal-rect";
import { trianglePeakRise } from "./thermal-triangle";
import { waveformRiseVI } from "./thermal-waveform";
import type { WaveformPulse } from "./types";

// A 48 V bus shorted behind a 20 A current limit, a 1 ms fault timer, 10 µH of loop, a 64 V clamp, one restart
// after 10 ms. Invented circuit; its figures worked by hand from the formulas in the comments.
const CLAMPED: SequenceInput = {
  supply: 48,
  limitCurrent: 20,
  holdTime: 1e-3,
  inductance: 10e-6,
  turnOff: { kind: "clamped", clampVoltage: 64 },
  restarts: 1,
  pause: 10e-3,
};

function built(input: SequenceInput) {
  const result = faultSequence(input);
  if (!result.ok) throw new Error(result.reason);
  return { figures: result.figures, pulse: result.pulses[0] as WaveformPulse };
}

/** The sequence's power without the builder's ε steps, written from the piece definitions (derived). */
function exactPower(input: SequenceInput, t: number, turnOffTime: number, epsilon: number): number {
  const off = input.turnOff.kind === "clamped" ? input.turnOff.clampVoltage : input.turnOff.breakdown;
  const period = input.holdTime + turnOffTime + (input.pause ?? 0);
  const k = Math.floor((t - epsilon) / period);
  if (k < 0 || k > input.restarts) return 0;
  const local = t - epsilon - k * period;
  if (local < input.holdTime) return input.supply * input.limitCurrent;
  if (local < input.holdTime + turnOffTime) {
    return off * input.limitCurrent * (1 - (local - input.holdTime) / turnOffTime);
  }
  return 0;
}

function trapezoidEnergy(pulse: WaveformPulse): number {
  let energy = 0;
  for (let n = 1; n < pulse.t.length; n++) {
    const p0 = pulse.v[n - 1] * pulse.i[n - 1];
    const p1 = pulse.v[n] * pulse.i[n];
    energy += ((p0 + p1) / 2) * (pulse.t[n] - pulse.t[n - 1]);
  }
  return energy;
}

describe("faultSequence", () => {
  it("48 V, 20 A for 1 ms, 10 µH into a 64 V clamp, one restart: 12.5 µs off, 0.96 J + 8 mJ per attempt", () => {
    // Worked by hand: t_off = L·I/(V_cl − V_bus) = 10 µH·20 A/16 V = 12.5 µs; hold V·I·t = 48·20·1 ms = 0.96 J;
    // turn-off ½·L·I²·V_cl/(V_cl − V_bus) = ½·10 µH·400·64/16 = 8 mJ (METHODS.md §11's clamp formulas).
    const { figures, pulse } = built(CLAMPED);
    expect(figures.turnOffTime).toBeCloseTo(12.5e-6, 15);
    expect(figures.holdEnergy).toBeCloseTo(0.96, 12);
    expect(figures.turnOffEnergy).toBeCloseTo(8e-3, 12);
    expect(figures.attempts).toBe(2);
    expect(figures.totalEnergy).toBeCloseTo(1.936, 12);
    expect(figures.peakPower).toBe(1280);
    // Two attempts of 1.0125 ms with the 10 ms pause between, plus the ε = 12.5 ns lead-in from rest.
    expect(figures.length).toBeCloseTo(2 * 1.0125e-3 + 10e-3 + 12.5e-9, 15);
    expect(pulse.start).toBe("rest");
    expect(pulse.i[0]).toBe(0);
    expect(pulse.i.at(-1)).toBe(0);
    expect(Math.max(...pulse.v)).toBe(64);
  });

  it("never draws less power than the sequence, and its energy exceeds it by the ε steps at most", () => {
    // Our choice of ε, derived bound: each step ramps over ε = 10⁻³ of the shortest piece on the higher power's side, adding at most
    // ½·ε·p_peak of energy; 4 steps per attempt.
    const { figures, pulse } = built(CLAMPED);
    const epsilon = 1e-3 * figures.turnOffTime;
    const energy = trapezoidEnergy(pulse);
    expect(energy).toBeGreaterThanOrEqual(figures.totalEnergy * (1 - 1e-12));
    expect(energy - figures.totalEnergy).toBeLessThanOrEqual(4 * 2 * 0.5 * epsilon * figures.peakPower);
    for (let n = 0; n < 4000; n++) {
      const t = (figures.length * n) / 3999;
      const j = Math.max(
        1,
        pulse.t.findIndex((s) => s >= t),
      );
      const w = (t - pulse.t[j - 1]) / (pulse.t[j] - pulse.t[j - 1]);
      const p0 = pulse.v[j - 1] * pulse.i[j - 1];
      const model = p0 + Math.min(Math.max(w, 0), 1) * (pulse.v[j] * pulse.i[j] - p0);
      expect(model).toBeGreaterThanOrEqual(
        exactPower(CLAMPED, t, figures.turnOffTime, epsilon) * (1 - 1e-9) - 1e-9,
      );
    }
  });

  it("a junction that does not cool between pieces: the whole rises above each piece alone", () => {
    // One Foster term with τ between the hold and the pause (invented). The engine's Tj over the sequence is
    // checked against odex (a general-purpose ODE integrator, E. Hairer's extrapolation method) driven by the
    // exact piecewise power, dθ/dt = (R·p − θ)/τ (Foster, METHODS.md §4).
    const network: FosterTerm[] = [{ r: 0.2, tau: 5e-3 }];
    const input: SequenceInput = { ...CLAMPED, pause: 2e-3, restarts: 2 };
    const { figures, pulse } = built(input);
    const rise = waveformRiseVI(pulse.t, pulse.v, pulse.i, network);
    const epsilon = 1e-3 * figures.turnOffTime;
    const period = input.holdTime + figures.turnOffTime + (input.pause ?? 0);
    const edges: number[] = [0];
    for (let k = 0; k <= input.restarts; k++) {
      const start = epsilon + k * period;
      edges.push(start, start + input.holdTime, start + input.holdTime + figures.turnOffTime);
    }
    let theta = [0];
    let peak = 0;
    for (let e = 1; e < edges.length; e++) {
      const solver = new Solver(1);
      solver.relativeTolerance = 1e-12;
      solver.absoluteTolerance = 1e-14;
      solver.maxSteps = 100_000;
      // The exact power on this piece: lead-in from rest, then per attempt hold, turn-off ramp, pause.
      const piece = e === 1 ? "rest" : (["hold", "ramp", "pause"] as const)[(e - 2) % 3];
      const from = edges[e - 1];
      const f = (t: number, y: number[]) => {
        const p =
          piece === "hold"
            ? input.supply * input.limitCurrent
            : piece === "ramp"
              ? figures.peakPower * (1 - (t - from) / figures.turnOffTime)
              : 0;
        return [(network[0].r * p - y[0]) / network[0].tau];
      };
      // The peak can fall inside a piece (the junction still rises early in the ramp): observe it in 64 steps.
      for (let step = 1; step <= 64; step++) {
        const t0 = from + ((edges[e] - from) * (step - 1)) / 64;
        theta = solver.solve(f, t0, theta, from + ((edges[e] - from) * step) / 64).y;
        peak = Math.max(peak, theta[0]);
      }
    }
    // The model's power is never below the exact power, so its rise is never below (conservative), and the ε steps
    // add almost nothing.
    expect(rise.maxRise).toBeGreaterThanOrEqual(peak * (1 - 1e-9));
    expect(rise.maxRise).toBeLessThanOrEqual(peak * (1 + 1e-4));
    // Each piece alone: the hold as a rectangle (Foster step response), the turn-off as a falling triangle.
    const holdAlone = rectRise(network, 48 * 20, input.holdTime);
    const turnOffAlone = trianglePeakRise(network, figures.peakPower, figures.turnOffTime);
    expect(rise.maxRise).toBeGreaterThan(1.2 * Math.max(holdAlone, turnOffAlone));
  });

  it("turns off in avalanche at V_BR with t_av = L·I/(V_BR − V_DD)", () => {
    // METHODS.md §13: 10 µH, 20 A, 48 V, V_BR 100 V → t_av 3.84615 µs, E = ½·L·I²·V_BR/(V_BR − V_DD) = 3.84615 mJ.
    const { figures, pulse } = built({
      ...CLAMPED,
      turnOff: { kind: "avalanche", breakdown: 100 },
      restarts: 0,
    });
    expect(figures.turnOffTime).toBeCloseTo(3.84615e-6, 10);
    expect(figures.turnOffEnergy).toBeCloseTo(3.84615e-3, 8);
    expect(Math.max(...pulse.v)).toBe(100);
    expect(figures.attempts).toBe(1);
  });

  // Our choice: every refusal names the input and says why.
  it("says which input is wrong", () => {
    expect(faultSequence({ ...CLAMPED, turnOff: { kind: "clamped", clampVoltage: 48 } })).toMatchObject({
      ok: false,
      reason: expect.stringContaining("clampVoltage (48 V) must exceed the supply"),
    });
    expect(faultSequence({ ...CLAMPED, pause: undefined })).toMatchObject({
      ok: false,
      reason: expect.stringContaining("pause must be"),
    });
    expect(faultSequence({ ...CLAMPED, restarts: 101 })).toMatchObject({
      ok: false,
      reason: expect.stringContaining("restarts must be a whole number from 0 to 100"),
    });
    expect(faultSequence({ ...CLAMPED, holdTime: 0 })).toMatchObject({ ok: false });
    // Without restarts the pause is not needed.
    expect(faultSequence({ ...CLAMPED, restarts: 0, pause: undefined }).ok).toBe(true);
  });
});

describe("unclampedTurnOff", () => {
  it("10 µH, 20 A, 48 V with 100 ns delay: 20.48 A into avalanche, inductor energy ½·L·I²", () => {
    // Derived from §11 and §13 by hand: I_pk = 20 + (48/10 µH)·100 ns = 20.48 A; ½·10 µH·20.48² = 2.097152 mJ.
    const result = unclampedTurnOff({ inductance: 10e-6, tripCurrent: 20, busVoltage: 48, delay: 1e-7 });
    if (!result.ok) throw new Error(result.reason);
    expect(result.figures.peakCurrent).toBeCloseTo(20.48, 12);
    expect(result.figures.inductorEnergy).toBeCloseTo(2.097152e-3, 12);
    expect(result.pulses).toEqual([
      {
        id: "unclamped-turn-off",
        kind: "avalanche",
        inductance: 10e-6,
        current: result.figures.peakCurrent,
        supply: 48,
      },
    ]);
    expect(unclampedTurnOff({ inductance: 10e-6, tripCurrent: 20, busVoltage: 48, delay: -1 }).ok).toBe(
      false,
    );
  });
});
