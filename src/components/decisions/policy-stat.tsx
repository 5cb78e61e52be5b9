import { q, settingPercent } from "@/lib/format";

/**
 * The stat block of a check's policy: the case temperature, with the utilisation limit, the junction guard and
 * (for records signed after it existed) the voltage limit under it.
 */
export function policyStat(policy: {
  caseTemp: number;
  utilisationLimit: number;
  tjGuard: number;
  voltageLimit?: number;
}) {
  return {
    label: "Case temperature",
    value: q(policy.caseTemp, "°C"),
    note: (
      <>
        limit {settingPercent(policy.utilisationLimit)} · T<sub>j</sub> guard{" "}
        {`${q(policy.tjGuard, "")}\u2009K`}
        {policy.voltageLimit === undefined ? null : ` · voltage limit ${settingPercent(policy.voltageLimit)}`}
      </>
    ),
  };
}
