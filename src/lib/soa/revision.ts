// The revision of METHODS.md this engine implements. Every decision and report records it, so that a verdict can
// always be traced to the rules it was found under; records without it were checked under revision 1.
export const METHODS_REVISION = 2;

/** The methods' revision a stored evaluation was found under (records of revision 1 do not say). */
export function revisionOf(record: { methodsRevision?: number }): number {
  return record.methodsRevision ?? 1;
}
