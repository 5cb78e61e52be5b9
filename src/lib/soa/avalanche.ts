// Unclamped inductive turn-off (METHODS.md §13, v2). With no clamp below breakdown, the drain rises to V_BR and the
// inductor's energy is dumped in the transistor while the current falls linearly to zero:
//   t_av = L·I/(V_BR − V_DD),   E = ½·L·I²·V_BR/(V_BR − V_DD)
// (the JEDEC JESD24-5 unclamped inductive switching test circuit; common textbook result). The rated E_AS holds
// at 25 °C starting junction temperature and is derated linearly to zero at Tj,max (common practice in datasheets):
//   k_av = (Tj,max − Tc)/(Tj,max − 25 °C), clamped to [0, 1].
import { derate } from "./derate";

/** Starting junction temperature at which avalanche energy ratings are given (common practice, no source). */
export const AVALANCHE_REF_TEMP = 25;

export interface AvalancheEvent {
  /** Time in avalanche, s. */
  time: number;
  /** Energy dumped in the transistor, J. */
  energy: number;
  /** Peak power V_BR·I, W (the power falls linearly to zero over `time`). */
  peakPower: number;
}

/** The avalanche event of cutting `current` A through `inductance` H from `supply` V into breakdown `breakdown` V. */
export function avalancheEvent(
  inductance: number,
  current: number,
  supply: number,
  breakdown: number,
): AvalancheEvent {
  const headroom = breakdown - supply;
  return {
    time: (inductance * current) / headroom,
    energy: (0.5 * inductance * current * current * breakdown) / headroom,
    peakPower: breakdown * current,
  };
}

/** k_av for case temperature `caseTemp` (°C) on a part with `tjMax`. */
export function avalancheDerating(tjMax: number, caseTemp: number): number {
  return derate(tjMax, caseTemp, AVALANCHE_REF_TEMP);
}
