import { describe, expect, it } from "vitest";
import { clampTurnOff, currentLimitFault, inrushPulses, tripWindow } from "./builders";
import { runCheck } from "./check";
import { triangleEquivalent, waveformEquivalent } from "./equivalent-rectangle";
import type { WaveformPulse } from "./types";

function ok<T extends { ok: boolean }>(result: T): Extract<T, { ok: true }> {
  if (!result.ok) throw new Error(JSON.stringify(result));
  return result as Extract<T, { ok: true }>;
}

describe("inrushPulses", () => {
  it("1000 µF, 48 V, 1 V/ms without load: 1 A for 48 ms, peak 48 W, 1.152 J, a falling triangle", () => {
    // METHODS.md §11 example (derived: I = C·S, t_r = V/S, E = ½·C·V²).
    const result = ok(inrushPulses({ capacitance: 1e-3, slew: 1000, supply: 48 }));
    expect(result.figures.chargeCurrent).toBeCloseTo(1, 12);
    expect(result.figures.rampTime).toBeCloseTo(48e-3, 12);
    expect(result.figures.peakPower).toBeCloseTo(48, 12);
    expect(result.figures.peakPowerTime).toBe(0);
    expect(result.figures.energy).toBeCloseTo(1.152, 12);
    expect(result.pulses).toEqual([{ id: "inrush", kind: "triangle", v: 48, i: 1, duration: 48e-3 }]);
    // Common practice, no source: a triangle of peak power P and width t holds P·t/2.
    expect(triangleEquivalent(48, 1, 48e-3).energy).toBeCloseTo(result.figures.energy, 12);
  });

  it("with a 4.8 Ω load: peak 145.2 W at 21.6 ms, energy 4.992 J, as a densely sampled capture", () => {
    // METHODS.md §11 example (derived from P(t) = (V_in − S·t)·(C_L·S + S·t/R_L)).
    const result = ok(
      inrushPulses({ capacitance: 1e-3, slew: 1000, supply: 48, load: 4.8, id: "precharge" }),
    );
    expect(result.figures.peakPower).toBeCloseTo(145.2, 9);
    expect(result.figures.peakPowerTime).toBeCloseTo(21.6e-3, 12);
    expect(result.figures.energy).toBeCloseTo(4.992, 12);
    const pulse = result.pulses[0] as WaveformPulse;
    expect(pulse).toMatchObject({ id: "precharge", kind: "waveform" });
    expect(pulse.t).toHaveLength(1001);
    const p = pulse.v.map((v, k) => v * pulse.i[k]);
    // The samples reproduce the figures: peak power, and the energy by the trapezoid rule over the whole
    // ramp.
    expect(Math.max(...p)).toBeCloseTo(145.2, 2);
    let energy = 0;
    for (let k = 1; k < p.length; k++) energy += ((p[k] + p[k - 1]) / 2) * (pulse.t[k] - pulse.t[k - 1]);
    expect(energy).toBeCloseTo(4.992, 4);
    const rect = waveformEquivalent(pulse.t, p);
    expect(rect.ok).toBe(true);
  });

  // Derived from §11: P(t) = (V_in − S·t)·(C_L·S + S·t/R_L) falls from t = 0 when the load term dominates.
  it("puts the peak at the start when the load current dominates", () => {
    const result = ok(inrushPulses({ capacitance: 1e-3, slew: 1000, supply: 4, load: 10, samples: 11 }));
    expect(result.figures.peakPowerTime).toBe(0);
    expect(result.figures.peakPower).toBeCloseTo(4, 12);
    expect((result.pulses[0] as WaveformPulse).t).toHaveLength(11);
  });

  // Our choice: a builder refuses inputs §11's formulas cannot use, with a reason.
  it("rejects inputs that are not finite and > 0, and too few samples", () => {
    expect(inrushPulses({ capacitance: 0, slew: 1, supply: 1 })).toEqual({
      ok: false,
      reason: "capacitance must be a finite number greater than 0, got 0",
    });
    expect(inrushPulses({ capacitance: 1, slew: 1, supply: 1, load: Number.NaN }).ok).toBe(false);
    expect(inrushPulses({ capacitance: 1, slew: 1, supply: 1, load: 1, samples: 2 }).ok).toBe(false);
  });
});

describe("currentLimitFault", () => {
  it("is a rectangle V_bus,max × I_lim,max for t_fault,max (P = V·I: common practice, no source)", () => {
    const result = ok(currentLimitFault({ busVoltageMax: 54, currentLimitMax: 20, faultTimeMax: 2e-3 }));
    expect(result.pulses).toEqual([{ id: "current-limit", kind: "rect", v: 54, i: 20, duration: 2e-3 }]);
    expect(result.figures).toEqual({ power: 1080, energy: 1080 * 2e-3, duty: null });
  });

  // Derived from §11 (auto-retry makes it a periodic train) and §7 (repeat { period, count? }).
  it("becomes a periodic train with auto-retry, finite or endless", () => {
    const endless = ok(
      currentLimitFault({ busVoltageMax: 54, currentLimitMax: 20, faultTimeMax: 2e-3, retryPeriod: 0.1 }),
    );
    expect(endless.pulses[0]).toMatchObject({ repeat: { period: 0.1 } });
    expect(endless.figures.duty).toBeCloseTo(0.02, 15);
    const counted = ok(
      currentLimitFault({
        busVoltageMax: 54,
        currentLimitMax: 20,
        faultTimeMax: 2e-3,
        retryPeriod: 0.1,
        retryCount: 7,
      }),
    );
    expect(counted.pulses[0]).toMatchObject({ repeat: { period: 0.1, count: 7 } });
  });

  // Derived from §7: the period must exceed the pulse's width and N ≥ 1.
  it("rejects a retry period not longer than the fault, and a bad count", () => {
    expect(
      currentLimitFault({ busVoltageMax: 1, currentLimitMax: 1, faultTimeMax: 1, retryPeriod: 1 }).ok,
    ).toBe(false);
    expect(
      currentLimitFault({
        busVoltageMax: 1,
        currentLimitMax: 1,
        faultTimeMax: 1,
        retryPeriod: 2,
        retryCount: 0,
      }).ok,
    ).toBe(false);
    expect(currentLimitFault({ busVoltageMax: -1, currentLimitMax: 1, faultTimeMax: 1 }).ok).toBe(false);
  });
});

describe("tripWindow", () => {
  it("R_sh 2 mΩ ±1 %, V_ref 1.200 V ±1 %, 23 kΩ/1 kΩ ±1 %, V_os ±2 mV: 25.00 / 23.05 / 27.01 A", () => {
    // METHODS.md §11 example (derived; worst case, not RSS), asserted to the digits shown.
    const result = ok(
      tripWindow({
        shunt: { nominal: 2e-3, tolerance: 0.01 },
        reference: { nominal: 1.2, tolerance: 0.01 },
        divider: { r1: 23e3, r2: 1e3, tolerance: 0.01 },
        offset: 2e-3,
      }),
    );
    expect(result.figures.nominal).toBeCloseTo(25.0, 2);
    expect(result.figures.min).toBeCloseTo(23.05, 2);
    expect(result.figures.max).toBeCloseTo(27.01, 2);
    expect(result.pulses).toEqual([]);
  });

  it("a 1.25 V trip threshold across a 10 mΩ shunt trips at 125 A", () => {
    // Common practice, no source.
    const result = ok(
      tripWindow({ shunt: { nominal: 10e-3, tolerance: 0 }, reference: { nominal: 1.25, tolerance: 0 } }),
    );
    expect(result.figures).toEqual({ nominal: 125, min: 125, max: 125 });
  });

  // Our choice: §11's trip window is refused where its worst case has no meaning.
  it("rejects bad values, tolerances outside [0, 1) and an offset that swallows the threshold", () => {
    const shunt = { nominal: 1e-3, tolerance: 0.01 };
    const reference = { nominal: 0.1, tolerance: 0.01 };
    expect(tripWindow({ shunt: { nominal: 0, tolerance: 0 }, reference }).ok).toBe(false);
    expect(tripWindow({ shunt, reference: { nominal: 1, tolerance: 1 } }).ok).toBe(false);
    expect(tripWindow({ shunt, reference, divider: { r1: 1, r2: 1, tolerance: -0.1 } }).ok).toBe(false);
    expect(tripWindow({ shunt, reference, offset: -1 }).ok).toBe(false);
    expect(tripWindow({ shunt, reference, offset: 0.2 })).toMatchObject({ ok: false });
  });
});

describe("clampTurnOff", () => {
  it("1 µH, 50 A, 48 V bus, 64 V clamp: 3.125 µs, 3200 W peak, 5.00 mJ", () => {
    // METHODS.md §11 example (derived).
    const result = ok(clampTurnOff({ inductance: 1e-6, tripCurrent: 50, busVoltage: 48, clampVoltage: 64 }));
    expect(result.figures.peakCurrent).toBe(50);
    expect(result.figures.clampTime).toBeCloseTo(3.125e-6, 15);
    expect(result.figures.peakPower).toBe(3200);
    expect(result.figures.energy).toBeCloseTo(5e-3, 12);
    expect(result.pulses).toEqual([
      { id: "clamp-turn-off", kind: "triangle", v: 64, i: 50, duration: result.figures.clampTime },
    ]);
    // Common practice, no source: the triangle's energy P·t/2 equals ½·L·I²·V_cl/(V_cl − V_bus).
    expect((3200 * 3.125e-6) / 2).toBeCloseTo(result.figures.energy, 12);
  });

  // Derived from §11: I_pk = I_trip,max + (V_bus/L)·t_delay.
  it("adds the current rise during the turn-off delay", () => {
    const result = ok(
      clampTurnOff({ inductance: 1e-6, tripCurrent: 50, busVoltage: 48, clampVoltage: 64, delay: 1e-7 }),
    );
    expect(result.figures.peakCurrent).toBeCloseTo(54.8, 12);
  });

  // Derived from §11: the clamp time L·I_pk/(V_cl − V_bus) needs V_cl > V_bus.
  it("rejects a clamp at or below the bus and a negative delay", () => {
    expect(clampTurnOff({ inductance: 1e-6, tripCurrent: 50, busVoltage: 48, clampVoltage: 48 }).ok).toBe(
      false,
    );
    expect(
      clampTurnOff({ inductance: 1e-6, tripCurrent: 50, busVoltage: 48, clampVoltage: 64, delay: -1 }).ok,
    ).toBe(false);
    expect(clampTurnOff({ inductance: 0, tripCurrent: 50, busVoltage: 48, clampVoltage: 64 }).ok).toBe(false);
  });

  // Derived from §9: whatever a builder returns is a valid pulse of the check contract.
  it("gives pulses the check contract accepts", () => {
    const pulses = [
      ...ok(clampTurnOff({ inductance: 1e-6, tripCurrent: 50, busVoltage: 48, clampVoltage: 64 })).pulses,
      ...ok(inrushPulses({ capacitance: 1e-3, slew: 1000, supply: 48, load: 4.8 })).pulses,
      ...ok(
        currentLimitFault({ busVoltageMax: 54, currentLimitMax: 20, faultTimeMax: 2e-3, retryPeriod: 0.1 }),
      ).pulses,
    ];
    const part = {
      vdsMax: 80,
      tjMax: 175,
      soa: { curves: [{ duration: 1e-3, points: [[1, 100] as [number, number]] }] },
    };
    expect(runCheck({ part, caseTemp: 25, pulses }).results).toHaveLength(3);
  });
});
