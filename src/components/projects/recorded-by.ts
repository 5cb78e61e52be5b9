import type { Person, Viewer } from "./project-workspace";

/**
 * Who recorded a measured pulse or a capture, as its table names them, and whether the viewer may delete it:
 * its author may, and whoever may manage measurements.
 */
export function recordedBy(viewer: Viewer, people: Person[]) {
  const names = new Map(people.map((p) => [p.id, p.name]));
  return {
    who: (createdBy: string | null) =>
      createdBy ? (createdBy === viewer.id ? "you" : (names.get(createdBy) ?? "a former member")) : "—",
    mayDelete: (createdBy: string | null) => createdBy === viewer.id || viewer.managesMeasurements,
  };
}
