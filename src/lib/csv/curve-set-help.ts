// The format description of the curve-set upload panel. Its downloadable examples are static files,
// public/examples/soa-curves-table.csv and soa-curves-paired.csv (src/lib/csv/public-examples.test.ts parses them).

/** The format in plain words, one paragraph per entry, for the upload panel. */
export const curveCsvHelp: readonly string[] = [
  "Upload the SOA figure of the datasheet as a CSV file (at most 5 MB): voltage V_DS on the X axis, drain current " +
    "I_D on the Y axis, one curve per pulse width, single pulse at the figure's case temperature.",
  "Table form: a header row naming a pulse-width column, a voltage column and a current column, then one row per " +
    "point, for example 'pulse width,V_DS [V],I_D [A]' and '100us,12,40'. A unit in the header scales its column " +
    "('I_D [mA]'); a blank pulse width repeats the one above.",
  "Paired columns: the first row names each curve ('10us', '100 µs', '1ms', 'DC') above its pair of columns, " +
    "voltage then current; a second row naming them ('V_DS [V],I_D [A]', or the axis letters X and Y) is " +
    "optional and its units scale the pair. Curves may have different numbers of points.",
  "Pulse widths are written with a unit ('100us', '100 µs', '1 ms', '1e-3 s') or as DC; in the table form a bare " +
    "number is in seconds unless the header gives a unit.",
  "Separators: comma, semicolon or tab. Decimal commas ('1,5') work with semicolons or tabs. Blank lines, a " +
    "byte-order mark and Windows line ends are fine.",
  "Every value must be greater than 0, each curve needs at least 2 points, a voltage may appear only once per " +
    "curve and a pulse width only once per file. Points need not be sorted; they are sorted by voltage and " +
    "out-of-order digitising is reported.",
];
