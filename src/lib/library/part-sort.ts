// The columns the library list sorts by: the list's URL state and the parts API take the same keys.

export const partSortKeys = [
  "partNumber",
  "maker",
  "technology",
  "package",
  "vdsMax",
  "rdsOn",
  "status",
  "updatedAt",
] as const;
export type PartSortKey = (typeof partSortKeys)[number];
