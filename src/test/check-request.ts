// The smallest valid check contract (METHODS.md §9) for the tests of the check API's access, transport and limits:
// one part with one 1 ms curve from (10 V, 40 A) to (40 V, 10 A), V_DS,max 80 V, T_j,max 175 °C, at a 25 °C case.
// On log-log axes the line gives 40·(20/10)^(ln(10/40)/ln(40/10)) = 20 A at 20 V, so 20 V × 10 A for 1 ms passes;
// 90 V is past V_DS,max and fails.

export const insidePulse = { id: "p1", kind: "rect", v: 20, i: 10, duration: 1e-3 } as const;
export const overVoltagePulse = { id: "over-voltage", kind: "rect", v: 90, i: 1, duration: 1e-3 } as const;

/** The request with the given pulses (one that passes unless told). */
export function smallCheckRequest(pulses: readonly object[] = [insidePulse]) {
  return {
    part: {
      vdsMax: 80,
      tjMax: 175,
      soa: {
        curves: [
          {
            duration: 1e-3,
            points: [
              [10, 40],
              [40, 10],
            ],
          },
        ],
      },
    },
    caseTemp: 25,
    pulses,
  };
}
