// Rows pasted from a spreadsheet or a datasheet table into the thermal model editor: "0.12<TAB>250us" per line.
// Cells split on tabs, else semicolons, else commas, else the first run of spaces ("0.12 250 us" keeps "250 us").
// A line whose first cell is not a number (a header such as "R_i [K/W]") is skipped.

export interface PastedRow {
  r: string;
  tau: string;
}

export function parsePastedRows(text: string): PastedRow[] {
  const rows: PastedRow[] = [];
  for (const raw of text.split(/\r?\n/)) {
    const line = raw.trim();
    if (!line) continue;
    const cells = split(line);
    if (cells.length < 2 || !/^[+-]?(\d|\.\d)/.test(cells[0])) continue;
    rows.push({ r: cells[0], tau: cells.slice(1).join(" ").trim() });
  }
  return rows;
}

function split(line: string): string[] {
  for (const separator of ["\t", ";", ","]) {
    if (line.includes(separator))
      return line
        .split(separator)
        .map((c) => c.trim())
        .filter(Boolean);
  }
  const match = /^(\S+)\s+(.+)$/.exec(line);
  return match ? [match[1], match[2]] : [line];
}
