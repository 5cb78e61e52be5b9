import { describe, expect, it } from "vitest";
import { avalancheDerating, avalancheEvent } from "./avalanche";

describe("avalanche (METHODS.md §13)", () => {
  // Worked value, METHODS.md §10 "v2 avalanche" (derived from the JEDEC JESD24-5 test-circuit formulas):
  // L 10 µH, I 20 A, V_DD 48 V, V_BR 100 V: t_av = L·I/(V_BR − V_DD) = 3.84615 µs, E = ½·L·I²·V_BR/(V_BR − V_DD)
  // = 3.84615 mJ; E_AS 50 mJ at Tj,max 175 °C from Tc 100 °C: k_av = 0.5, u = E/(E_AS·k_av) = 0.153846.
  it("gives t_av 3.84615 µs, E 3.84615 mJ, k_av 0.5 and u = 0.153846", () => {
    const event = avalancheEvent(10e-6, 20, 48, 100);
    expect(event.time).toBeCloseTo(3.84615e-6, 10);
    expect(event.energy).toBeCloseTo(3.84615e-3, 8);
    expect(event.peakPower).toBe(2000);
    const k = avalancheDerating(175, 100);
    expect(k).toBe(0.5);
    expect(event.energy / (0.05 * k)).toBeCloseTo(0.153846, 6);
  });

  // Common practice, no source: a triangle of peak power P and width t holds energy P·t/2.
  it("dumps the energy of a falling triangle of peak V_BR·I over t_av", () => {
    const event = avalancheEvent(33e-6, 12, 24, 80);
    expect((event.peakPower * event.time) / 2).toBeCloseTo(event.energy, 15);
  });

  it("derates E_AS linearly from 25 °C to nothing at Tj,max, never above 1", () => {
    expect(avalancheDerating(150, 25)).toBe(1);
    expect(avalancheDerating(150, -40)).toBe(1);
    expect(avalancheDerating(150, 150)).toBe(0);
  });
});
