// The downloadable examples and the format description of the curve-set upload panel. The numbers are invented
// for a fictional 100 V part (R_DS(on) line 5 mΩ, 300 A pulsed and 100 A continuous limits, constant-power lines
// of 6 kW, 2 kW, 600 W, 250 W and 150 W); they describe no real product.

/** A long table: one row per point. */
export const exampleLongCsv = `pulse width,V_DS [V],I_D [A]
10us,0.1,20
10us,1.5,300
10us,20,300
10us,50,120
10us,100,60
100us,0.1,20
100us,1.5,300
100us,6.67,300
100us,100,20
1ms,0.1,20
1ms,1.5,300
1ms,2,300
1ms,10,60
1ms,100,6
10ms,0.1,20
10ms,1.12,224
10ms,100,2.5
DC,0.1,20
DC,0.5,100
DC,1.5,100
DC,100,1.5
`;

/** Paired columns: curve names above V/I column pairs, a row naming the quantities, curves of different lengths. */
export const examplePairedCsv = `10us,,100 µs,,1ms,,DC,
V_DS [V],I_D [A],V_DS [V],I_D [A],V_DS [V],I_D [A],V_DS [V],I_D [A]
0.1,20,0.1,20,0.1,20,0.1,20
1.5,300,1.5,300,1.5,300,0.5,100
20,300,6.67,300,2,300,1.5,100
50,120,100,20,10,60,100,1.5
100,60,,,100,6,,
`;

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
