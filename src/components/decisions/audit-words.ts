import { q, settingPercent } from "@/lib/format";
import type { AuditEvent } from "./types";

// A project's audit events in plain words: what was done, with the names the details kept.

const text = (value: unknown): string | null => (typeof value === "string" && value ? value : null);
const num = (value: unknown): number | null => (typeof value === "number" ? value : null);
const quoted = (value: unknown) => (text(value) ? ` “${text(value)}”` : "");

export function auditWords(event: AuditEvent): string {
  const d = event.details ?? {};
  switch (event.action) {
    case "project.created":
      return `created the project${quoted(d.name)}`;
    case "project.updated": {
      const parts = [
        num(d.caseTemp) !== null ? `case ${q(num(d.caseTemp), "°C")}` : null,
        num(d.utilisationLimit) !== null
          ? `utilisation limit ${settingPercent(num(d.utilisationLimit))}`
          : null,
        num(d.tjGuard) !== null ? `Tj guard ${q(num(d.tjGuard), "")}\u2009K` : null,
      ].filter(Boolean);
      return `changed the project's settings${parts.length ? `: ${parts.join(", ")}` : ""}`;
    }
    case "project.archived":
      return "archived the project";
    case "project.restored":
      return "restored the project";
    case "candidate.added":
      return `added the candidate ${text(d.partNumber) ?? "part"}`;
    case "candidate.removed":
      return `removed a candidate${text(d.partNumber) ? ` (${text(d.partNumber)})` : ""}`;
    case "fault-case.created":
      return `added the fault case${quoted(d.name)}`;
    case "fault-case.updated":
      return `edited the fault case${quoted(d.name)}`;
    case "fault-case.deleted":
      return `deleted the fault case${quoted(d.name)}`;
    case "measurements.added": {
      const count = num(d.count) ?? 0;
      const board = text(d.boardSerial);
      return `logged ${count} measured ${count === 1 ? "pulse" : "pulses"}${board ? ` on board ${board}` : ""}`;
    }
    case "measurement.updated":
      return "edited a measured pulse";
    case "measurement.deleted":
      return `deleted the measured pulse${quoted(d.label)}`;
    case "capture.added":
      return `uploaded the capture${quoted(d.name)}`;
    case "capture.deleted":
      return `deleted the capture${quoted(d.name)}`;
    case "decision.signed":
      return `signed the decision for ${text(d.chosen) ?? "a candidate"}`;
    default:
      return event.action.replace(/[.-]/g, " ");
  }
}
