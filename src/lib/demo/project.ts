import type { PulseOrigin } from "@/db/schema";
import { type PulseColumns, pulseColumns } from "@/lib/projects/pulse-columns";
import { currentLimitFault, inrushPulses } from "@/lib/soa/builders";
import type { Pulse } from "@/lib/soa/types";
import { DEMO_SCENARIO } from "./parts";

// The demo project's pulses (PRODUCT.md's scenario, invented): fault cases made by the pulse builders from the
// circuit's figures, and measured pulses as a technician would log them. With the demo parts at 85 °C case they
// show every verdict: the lowest-R_DS(on) part fails the inrush, the linear-mode part passes everything.

export const demoProjectName = "48 V battery disconnect, cargo bike";

interface DemoFaultCase extends PulseColumns {
  name: string;
  origin: PulseOrigin;
  notes: string;
}

function shaped(pulse: Pulse): PulseColumns {
  if (pulse.kind === "waveform" || pulse.kind === "avalanche") {
    throw new Error("demo fault cases are rectangles or triangles");
  }
  return pulseColumns(pulse);
}

function built<I extends object, F extends object>(
  name: string,
  builder: string,
  input: I,
  run: (input: I) => { ok: true; pulses: Pulse[]; figures: F } | { ok: false; reason: string },
  notes: string,
): DemoFaultCase {
  const result = run(input);
  if (!result.ok) throw new Error(`demo fault case ${name}: ${result.reason}`);
  return {
    name,
    ...shaped(result.pulses[0]),
    origin: {
      builder,
      input: { ...input } as Record<string, unknown>,
      figures: { ...result.figures } as Record<string, unknown>,
    },
    notes,
  };
}

export function demoFaultCases(): DemoFaultCase[] {
  return [
    built(
      "Pre-charge inrush into the motor controller",
      "inrush",
      {
        capacitance: DEMO_SCENARIO.inrush.capacitance,
        slew: DEMO_SCENARIO.inrush.slew,
        supply: DEMO_SCENARIO.inrush.supply,
      },
      inrushPulses,
      "1.5 mF of controller bulk capacitance charged at 1 V/ms from the 48 V pack, no load during the ramp.",
    ),
    built(
      "Output short until the protection turns off",
      "current-limit",
      { busVoltageMax: 54.6, currentLimitMax: 40, faultTimeMax: 100e-6 },
      currentLimitFault,
      "Full pack (13 × 4.2 V), current limit at its highest setting, 100 µs longest hold before turn-off.",
    ),
    built(
      "Overload restart train",
      "current-limit",
      { busVoltageMax: 54.6, currentLimitMax: 8, faultTimeMax: 2e-3, retryPeriod: 0.1, retryCount: 20 },
      currentLimitFault,
      "Motor stall: 8 A limit for 2 ms, restarted every 100 ms, 20 times before the protection latches off.",
    ),
  ];
}

export function demoMeasuredPulses() {
  return [
    {
      label: "Pre-charge, board TW-03",
      kind: "triangle" as const,
      v: 48.2,
      i: 1.62,
      duration: 0.046,
      boardSerial: "TW-03",
    },
    {
      label: "Short, board TW-03",
      kind: "rect" as const,
      v: 51,
      i: 36,
      duration: 90e-6,
      boardSerial: "TW-03",
    },
    {
      label: "Stall restarts, board TW-03",
      kind: "rect" as const,
      v: 40,
      i: 9,
      duration: 1.8e-3,
      repeatPeriod: 0.1,
      repeatCount: 20,
      boardSerial: "TW-03",
    },
    {
      label: "Brake regen clamp, board TW-05",
      kind: "rect" as const,
      v: 12,
      i: 30,
      duration: 5e-3,
      boardSerial: "TW-05",
    },
  ].map((m) => ({
    repeatPeriod: null,
    repeatCount: null,
    probe: "100:1 differential, 50 A current probe",
    note: "Logged on the bench (invented demo data).",
    ...m,
  }));
}
