// The check API's load body: one invented part (four pulse widths and DC, a Foster network) and 20 pulses of
// every shaped kind, single and repeated, the size a bench script sends.

const widths = [1e-5, 1e-4, 1e-3, 1e-2];
const voltages = [0.5, 1, 2, 5, 10, 20, 40, 60];

export function checkBody() {
  const curve = (duration: number | "DC", power: number) => ({
    duration,
    points: voltages.map((v) => [v, Math.min(v / 4e-3, 240, power / v)]),
  });
  return {
    part: {
      vdsMax: 60,
      tjMax: 175,
      idPulseMax: 240,
      rdsOn: 4e-3,
      foster: [
        { r: 0.04, tau: 2e-5 },
        { r: 0.2, tau: 1.5e-3 },
        { r: 0.35, tau: 6e-2 },
      ],
      soa: { curves: [...widths.map((t, k) => curve(t, 2400 / 2 ** k)), curve("DC", 220)] },
    },
    caseTemp: 85,
    pulses: Array.from({ length: 20 }, (_, k) => {
      const base = { id: `p${k + 1}`, v: 4 + 2.5 * k, i: 60 - 2.5 * k, duration: 10 ** (-5 + (k % 8) * 0.5) };
      const kind = k % 2 === 0 ? "rect" : "triangle";
      return k % 5 === 4
        ? { ...base, kind, repeat: { period: base.duration * 10, count: 5 } }
        : { ...base, kind };
    }),
  };
}
