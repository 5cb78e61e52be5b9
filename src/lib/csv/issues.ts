// Problems found in an uploaded CSV, each pointing at a cell the way a spreadsheet shows it: a 1-based row number
// and the column's header name (or its letter where the header names none). Shared by every CSV reader of the
// app, so that the upload panel lists all of them in one form.

/** One problem in a CSV. `message` is the whole sentence ("row 7, column I_D [A]: 'abc' is not a number"). */
export interface CsvIssue {
  /** 1-based row as a spreadsheet numbers it; null for the file as a whole. */
  row: number | null;
  /** The column's header name, or its letter; null for a whole row or the whole file. */
  column: string | null;
  /** The reason alone, for a table that shows row and column in their own cells. */
  reason: string;
  message: string;
}

/** Builds an issue with its full message. */
export function csvIssue(row: number | null, column: string | null, reason: string): CsvIssue {
  const where = [row === null ? null : `row ${row}`, column === null ? null : `column ${column}`]
    .filter((part) => part !== null)
    .join(", ");
  return { row, column, reason, message: where === "" ? reason : `${where}: ${reason}` };
}

/**
 * A bounded list of issues: beyond `limit`, issues are counted, not kept. `list()` gives them by row (issues about
 * the whole file first, ties in the order found), then one that says how many more there were.
 */
export interface IssueList {
  add(row: number | null, column: string | null, reason: string): void;
  readonly count: number;
  list(): CsvIssue[];
}

/** Collects up to `limit` issues (50 by default: enough to fix a file in one pass, short enough to read). */
export function createIssueList(limit = 50): IssueList {
  const items: CsvIssue[] = [];
  let dropped = 0;
  return {
    add(row, column, reason) {
      if (items.length < limit) items.push(csvIssue(row, column, reason));
      else dropped++;
    },
    get count() {
      return items.length + dropped;
    },
    list() {
      const sorted = [...items].sort((a, b) => (a.row ?? 0) - (b.row ?? 0));
      if (dropped === 0) return sorted;
      const more = csvIssue(
        null,
        null,
        `${dropped} more ${dropped === 1 ? "problem" : "problems"} not listed`,
      );
      return [...sorted, more];
    },
  };
}

/** Spreadsheet column letter of a 0-based column index: 0 → "A", 25 → "Z", 26 → "AA". */
export function columnLetter(index: number): string {
  let n = index + 1;
  let letters = "";
  while (n > 0) {
    const rest = (n - 1) % 26;
    letters = String.fromCharCode(65 + rest) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}
