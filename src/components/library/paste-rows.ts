// Rows pasted from a spreadsheet or a datasheet table into the thermal model editor: "0.12<TAB>250us" per line.
// Read by the app's one CSV reader (src/lib/csv/text.ts): its separator rule over the pasted lines (tab, else ";",
// else ","), its tokeniser for the cells. Two things only a paste needs: a line holding none of the three
// separators splits at its first run of spaces ("0.12 250 us" keeps "250 us"), and a line whose first cell is not
// a number (a header such as "R_i [K/W]") is skipped. Empty cells are dropped ("0.12<TAB><TAB>250us").
import { guessDelimiter, normaliseText, splitLine } from "@/lib/csv/text";

export interface PastedRow {
  r: string;
  tau: string;
}

export function parsePastedRows(text: string): PastedRow[] {
  const lines = normaliseText(text)
    .split("\n")
    .map((line) => line.trim())
    .filter((line) => line !== "");
  const delimiter = guessDelimiter(lines);
  const rows: PastedRow[] = [];
  for (const line of lines) {
    const cells = line.includes(delimiter) ? splitLine(line, delimiter).filter(Boolean) : splitAtSpace(line);
    if (cells.length < 2 || !/^[+-]?(\d|\.\d)/.test(cells[0])) continue;
    rows.push({ r: cells[0], tau: cells.slice(1).join(" ").trim() });
  }
  return rows;
}

function splitAtSpace(line: string): string[] {
  const match = /^(\S+)\s+(.+)$/.exec(line);
  return match ? [match[1], match[2]] : [line];
}
