// What a stored finding is known by, apart from the verify schema so the screens that show findings carry no zod.

/** What a stored finding is known by: its key, or its message for findings stored before keys existed. */
export interface FindingLike {
  key?: string;
  message: string;
}

/** A finding's key, or its message for findings stored before keys existed. */
export function findingKey(f: FindingLike): string {
  return f.key ?? f.message;
}
