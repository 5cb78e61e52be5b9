// Long file: one short case per curve-set file shape and per problem the reader reports.
// Expected values are derived by hand from the file contents (unit prefixes: SI, common practice, no source),
// unless a comment names another source.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { findCurveSetIssues } from "@/lib/soa/findings";
import { readExample } from "@/test/examples";
import { type CurveSetCsvResult, digitisedCurveSet, parseCurveSetCsv } from "./curve-set";
import { curveCsvHelp } from "./curve-set-help";
import { MAX_CSV_BYTES } from "./limits";

const exampleLongCsv = readExample("soa-curves-table.csv");
const examplePairedCsv = readExample("soa-curves-paired.csv");

const THIN = "\u2009";

type Parsed = Extract<CurveSetCsvResult, { ok: true }>;

function parsed(text: string): Parsed {
  const result = parseCurveSetCsv(text);
  if (!result.ok) throw new Error(result.errors.map((e) => e.message).join("\n"));
  return result;
}

function errorsOf(text: string, maxBytes?: number): string[] {
  const result = parseCurveSetCsv(text, { maxBytes });
  if (result.ok) throw new Error("expected the file to be rejected");
  return result.errors.map((e) => e.message);
}

function summary(result: Parsed) {
  return result.curves.map((c) => ({ duration: c.duration, points: c.points }));
}

const TWO_CURVES = [
  {
    duration: 1e-4,
    points: [
      [1, 100],
      [10, 50],
    ],
  },
  {
    duration: "DC",
    points: [
      [1, 20],
      [10, 2],
    ],
  },
];

describe("parseCurveSetCsv, long form", () => {
  test("reads the downloadable example: five curves, 21 rows, no warnings", () => {
    const result = parsed(exampleLongCsv);
    expect(result.shape).toBe("long");
    expect(result.rows).toBe(21);
    expect(result.warnings).toEqual([]);
    expect(result.curves.map((c) => c.duration)).toEqual([1e-5, 1e-4, 1e-3, 1e-2, "DC"]);
    expect(result.curves[0].points).toEqual([
      [0.1, 20],
      [1.5, 300],
      [20, 300],
      [50, 120],
      [100, 60],
    ]);
    expect(result.curves[0].sourceRows).toEqual([2, 3, 4, 5, 6]);
  });

  test.each([
    ["width,V,I"],
    ["pulse width,Vds (V),Id (A)"],
    ["Duration,voltage,current"],
    ["tp,V_DS [V],I_D [A]"],
    ["t_p [s],V_DS / V,I_D in A"],
    ["T_P [S],VOLTAGE,DRAIN CURRENT"],
    ["Pulse-Width,Drain-source voltage,I_D (A)"],
    ["time [sec],V_CE [V],I_C [A]"],
  ])("recognises the header %s", (header) => {
    const text = `${header}\n100us,1,100\n100us,10,50\nDC,1,20\nDC,10,2\n`;
    expect(summary(parsed(text))).toEqual(TWO_CURVES);
  });

  test("recognises columns in any order and by unit alone, and ignores others with a warning", () => {
    const text = "I [A],notes,X [V],pulse width\n100,a,1,100us\n50,,10,100us\n20,,1,DC\n2,,10,DC\n";
    const result = parsed(text);
    expect(summary(result)).toEqual(TWO_CURVES);
    expect(result.warnings.map((w) => w.message)).toEqual([
      "row 1, column notes: column ignored: not a pulse width, voltage or current",
    ]);
  });

  test("a unit in the header scales bare numbers of its column", () => {
    const text = "t_p [ms],V_DS [kV],Id [mA]\n0.1,0.001,100000\n0.1,0.01,50000\n";
    // derived: 0.1 ms = 1e-4 s, 0.001 kV = 1 V, 100000 mA = 100 A
    expect(summary(parsed(text))[0]).toEqual({ duration: 1e-4, points: TWO_CURVES[0].points });
  });

  test("a cell with its own unit is read as written, not scaled again by the header", () => {
    const text = "t_p [ms],V_DS [V],Id [mA]\n100us,1 V,100 A\n100 µs,10000 mV,50000\n";
    expect(summary(parsed(text))[0]).toEqual({ duration: 1e-4, points: TWO_CURVES[0].points });
  });

  test.each([
    ["100us", 1e-4],
    ["100 us", 1e-4],
    ["100µs", 1e-4],
    ["100 µs", 1e-4],
    ["100 μs", 1e-4], // Greek mu U+03BC, as some keyboards type it
    ["100 usec", 1e-4],
    ["0.1ms", 1e-4],
    ["0.1 MS", 1e-4],
    ["1 ms", 1e-3],
    ["1ms", 1e-3],
    ["10 s", 10],
    ["1e-3", 1e-3],
    ["1E-3", 1e-3],
    ["5e-6 s", 5e-6],
    ["500 ns", 5e-7],
    ["DC", "DC"],
    ["dc", "DC"],
  ])("reads the pulse width %s", (cell, seconds) => {
    const text = `width,V,I\n${cell},1,100\n${cell},10,50\n`;
    expect(parsed(text).curves[0].duration).toBe(seconds);
  });

  test("rows of the same width written differently form one curve", () => {
    const text = "width,V,I\n100us,1,100\n0.1 ms,10,50\n";
    const result = parsed(text);
    expect(result.curves).toHaveLength(1);
    expect(result.curves[0].label).toBe("100us");
  });

  test("a blank width cell repeats the width above; a row with only a width starts a group", () => {
    const text = "width,V,I\n100us,1,100\n,10,50\nDC,,\n,1,20\n,10,2\n";
    expect(summary(parsed(text))).toEqual(TWO_CURVES);
  });

  test("rows of one width that are not together are one curve, with a warning", () => {
    const text = "width,V,I\n100us,1,100\nDC,1,20\nDC,10,2\n100us,10,50\n";
    const result = parsed(text);
    expect(summary(result)).toEqual(TWO_CURVES);
    expect(result.warnings.map((w) => w.message)).toEqual([
      "row 5, column width: the rows for 100us are not together; they were read as one curve",
    ]);
  });
});

describe("parseCurveSetCsv, paired columns", () => {
  test("reads the downloadable example: curves of different lengths under X/Y pairs", () => {
    const result = parsed(examplePairedCsv);
    expect(result.shape).toBe("paired");
    expect(result.rows).toBe(5);
    expect(result.curves.map((c) => [c.label, c.duration, c.points.length])).toEqual([
      ["10us", 1e-5, 5],
      ["100 µs", 1e-4, 4],
      ["1ms", 1e-3, 5],
      ["DC", "DC", 4],
    ]);
    expect(result.curves[3].points[3]).toEqual([100, 1.5]);
    expect(result.curves[1].sourceRows).toEqual([3, 4, 5, 6]);
  });

  test("reads the same curves without an axis row, and with the name repeated over the Y column", () => {
    const plain = "100us,,DC,\n1,100,1,20\n10,50,10,2\n";
    const repeated = "100us,100us,DC,DC\nX,Y,X,Y\n1,100,1,20\n10,50,10,2\n";
    expect(summary(parsed(plain))).toEqual(TWO_CURVES);
    expect(summary(parsed(repeated))).toEqual(TWO_CURVES);
  });

  test("curve names may carry words around the width", () => {
    const text = "tp = 100 µs single pulse,,DC operation,\n1,100,1,20\n10,50,10,2\n";
    expect(summary(parsed(text))).toEqual(TWO_CURVES);
  });

  test("an axis row with units scales its columns, and current named first swaps the pair", () => {
    const text = "100us,,DC,\nV_DS [V],I_D [mA],I [A],V [mV]\n1,100000,20,1000\n10,50000,2,10000\n";
    expect(summary(parsed(text))).toEqual(TWO_CURVES);
  });

  test("a curve may end early: trailing empty cells are skipped", () => {
    const text = "100us,,DC,\n1,100,1,20\n10,50,5,6\n,,10,2\n";
    const result = parsed(text);
    expect(result.curves.map((c) => c.points.length)).toEqual([2, 3]);
  });
});

describe("parseCurveSetCsv, sanity limits", () => {
  test("refuses physically absurd points and widths with the limit (src/lib/soa/sanity.ts)", () => {
    const messages = errorsOf(
      "pulse width,V_DS [kV],I_D [A]\n10us,0.01,20\n10us,1000,2\n1e7 s,0.01,1\n1e7 s,0.02,1\n",
    );
    expect(messages).toContain(
      "row 3, column V_DS [kV]: '1000': 1\u2009MV is above 100\u2009kV, the most a voltage can be here: check the prefix and the unit",
    );
    expect(messages.some((m) => m.includes("above 1\u2009Ms, the most a time can be here"))).toBe(true);
  });
});

describe("parseCurveSetCsv, text variants", () => {
  test.each([
    ["semicolons", "width;V;I\n100us;1;100\n100us;10;50\nDC;1;20\nDC;10;2\n"],
    ["tabs", "width\tV\tI\n100us\t1\t100\n100us\t10\t50\nDC\t1\t20\nDC\t10\t2\n"],
    ["decimal commas with semicolons", "width;V;I\n0,1 ms;1,0;100,0\n100us;10;50\nDC;1;20\nDC;1,0e1;2\n"],
    ["decimal commas with tabs", "width\tV\tI\n100us\t1,0\t1,0e2\n100us\t10\t50\nDC\t1\t20\nDC\t10\t2,0\n"],
    ["a byte-order mark", "\uFEFFwidth,V,I\n100us,1,100\n100us,10,50\nDC,1,20\nDC,10,2\n"],
    ["CRLF line ends", "width,V,I\r\n100us,1,100\r\n100us,10,50\r\nDC,1,20\r\nDC,10,2\r\n"],
    ["CR line ends", "width,V,I\r100us,1,100\r100us,10,50\rDC,1,20\rDC,10,2"],
    ["blank lines", "\n\nwidth,V,I\n\n100us,1,100\n100us,10,50\n\n\nDC,1,20\nDC,10,2\n\n"],
    ["whitespace around cells", "  width , V ,\tI \n 100us , 1 , 100\n100us,10 ,50\nDC , 1,20 \n  DC,10,2\n"],
    ["scientific notation", "width,V,I\n1.0E-4,1e0,1.00e+2\n1e-4,1.0e1,5E1\nDC,1,2e1\nDC,10,0.2e1\n"],
    ["quoted cells", '"width","V","I"\n"100us","1","100"\n100us,10,50\nDC,1,20\nDC,10,2\n'],
    [
      "a semicolon file with blank-line padding and a BOM",
      "\uFEFF\r\nwidth;V;I\r\n100us;1;100\r\n100us;10;50\r\nDC;1;20\r\nDC;10;2\r\n",
    ],
    [
      "paired columns with semicolons and decimal commas",
      "100us;;DC;\nX;Y;X;Y\n1,0;100;1;20\n10;50;10;2,0\n",
    ],
    ["paired columns with tabs", "100us\t\tDC\t\n1\t100\t1\t20\n10\t50\t10\t2\n"],
  ])("reads %s", (_, text) => {
    expect(summary(parsed(text))).toEqual(TWO_CURVES);
  });

  test("row numbers count blank lines, as a spreadsheet shows them", () => {
    const text = "width,V,I\n\n100us,1,100\n\n100us,10,abc\n";
    expect(errorsOf(text)).toEqual(["row 5, column I: 'abc' is not a number"]);
  });
});

describe("parseCurveSetCsv, point order", () => {
  const text = "width,V_DS [V],I_D [A]\n1ms,10,8\n1ms,1,80\n1ms,40,2\n1ms,20,4\n";

  test("sorts points by voltage and keeps where each came from", () => {
    const [curve] = parsed(text).curves;
    expect(curve.points).toEqual([
      [1, 80],
      [10, 8],
      [20, 4],
      [40, 2],
    ]);
    expect(curve.rawOrderIndex).toEqual([1, 0, 3, 2]);
    expect(curve.sourceRows).toEqual([3, 2, 5, 4]);
  });

  test("warns about the first point out of order", () => {
    expect(parsed(text).warnings.map((w) => w.message)).toEqual([
      "row 3, column V_DS [V]: the 1ms curve's voltages do not rise (row 3 is below row 2); the points were sorted",
    ]);
  });

  test("digitisedCurveSet gives the order as digitised, so the engine's findings see it", () => {
    const set = digitisedCurveSet(parsed(text).curves);
    expect(set.curves[0].points).toEqual([
      [10, 8],
      [1, 80],
      [40, 2],
      [20, 4],
    ]);
    // The engine's own quality findings (findings.ts) report the two steps down.
    expect(findCurveSetIssues(set).map((f) => f.kind)).toEqual(["not-increasing", "not-increasing"]);
  });
});

describe("parseCurveSetCsv rejects, naming row, column and reason", () => {
  test.each([
    [
      "not a number",
      "width,V_DS [V],I_D [A]\n1ms,1,10\n1ms,2,abc\n",
      "row 3, column I_D [A]: 'abc' is not a number",
    ],
    [
      "zero",
      "width,V_DS [V],I_D [A]\n1ms,0,10\n1ms,2,5\n",
      "row 2, column V_DS [V]: '0' must be greater than 0",
    ],
    [
      "negative",
      "width,V_DS [V],I_D [A]\n1ms,1,-10\n1ms,2,5\n",
      "row 2, column I_D [A]: '-10' must be greater than 0",
    ],
    [
      "overflow",
      "width,V_DS [V],I_D [A]\n1ms,1e999,10\n1ms,2,5\n",
      "row 2, column V_DS [V]: '1e999' is not a finite number",
    ],
    [
      "Infinity",
      "width,V_DS [V],I_D [A]\n1ms,1,Infinity\n1ms,2,5\n",
      "row 2, column I_D [A]: 'Infinity' is not a number",
    ],
    ["NaN", "width,V_DS [V],I_D [A]\n1ms,NaN,1\n1ms,2,5\n", "row 2, column V_DS [V]: 'NaN' is not a number"],
    [
      "a wrong unit in a cell",
      "width,V_DS [V],I_D [A]\n1ms,1 A,1\n1ms,2,5\n",
      "row 2, column V_DS [V]: '1 A': expected unit 'V', got 'A'",
    ],
    [
      "an empty cell",
      "width,V_DS [V],I_D [A]\n1ms,1,\n1ms,2,5\n",
      "row 2, column I_D [A]: the cell is empty",
    ],
    ["a zero width", "width,V,I\n0,1,10\n0,2,5\n", "row 2, column width: '0' must be greater than 0"],
    [
      "an unreadable width",
      "width,V,I\nfast,1,10\n1ms,2,5\n1ms,3,4\n",
      "row 2, column width: 'fast' is not a pulse width (write for example 100us, 1 ms, 1e-3 or DC)",
    ],
    [
      "a first row without a width to repeat",
      "width,V,I\n,1,10\n1ms,2,5\n1ms,3,4\n",
      "row 2, column width: the cell is empty and no pulse width above it can be repeated",
    ],
    [
      "a repeated voltage",
      "width,V_DS [V],I_D [A]\n1ms,1,10\n1ms,2,5\n1ms,1,9\n",
      `row 4, column V_DS [V]: voltage 1${THIN}V appears twice on the 1ms curve (rows 2 and 4)`,
    ],
    [
      "a curve with one point",
      "width,V,I\n1ms,1,10\n1ms,2,5\nDC,1,1\n",
      "row 4, column width: the DC curve has only 1 point; a curve needs at least 2",
    ],
    ["a header only", "width,V,I\n\n", "no curves found: the file has a header but no points under it"],
    ["an empty file", "\uFEFF \n\n  \n", "the file is empty"],
    [
      "a missing column",
      "width,V_DS [V]\n1ms,1\n1ms,2\n",
      "row 1: no current column: name one in the header, for example 'I_D [A]'",
    ],
    [
      "two columns for one quantity",
      "width,V,I,Voltage\n1ms,1,10,1\n1ms,2,5,2\n",
      "row 1, column Voltage: a second voltage column (the first is V); keep one",
    ],
    [
      "a header unit that does not fit",
      "width,V_DS [V],I_D [V]\n1ms,1,10\n1ms,2,5\n",
      "row 1, column I_D [V]: unit 'V' does not fit a current (expected A)",
    ],
    [
      "a decimal comma in a comma-separated file",
      "width,V,I\n1ms,1,5,10\n1ms,2,5\n1ms,3,4\n",
      "row 2, column D: '10' lies beyond the header's columns (decimal commas need ';' or tab as the separator)",
    ],
    [
      "a quoted decimal comma in a comma-separated file",
      'width,V,I\n1ms,"1,5",10\n1ms,2,5\n',
      "row 2, column V: '1,5' is not a number (use '.' for decimals)",
    ],
    [
      "an unclosed quote",
      'width,V,I\n1ms,1,10\n1ms,"2,5\n',
      'row 3: a quoted cell is not closed (a " is missing)',
    ],
    [
      "a table without header",
      "1ms,1,10\n1ms,2,5\n",
      "row 1: the first row names neither the columns of a table (pulse width, V_DS [V], I_D [A]) nor curves above X/Y column pairs (10us in column A, 1ms in column C, …)",
    ],
    [
      "a first row of neither shape",
      "foo,bar\n1,2\n",
      "row 1: the first row names neither the columns of a table (pulse width, V_DS [V], I_D [A]) nor curves above X/Y column pairs (10us in column A, 1ms in column C, …)",
    ],
  ])("%s", (_, text, message) => {
    expect(errorsOf(text)).toContain(message);
  });

  test.each([
    [
      "one empty cell of a pair",
      "100us,,DC,\nX,Y,X,Y\n1,100,1,20\n10,,10,2\n",
      "row 4, column B (100us, Y): the cell is empty",
    ],
    [
      "a bad number under an axis name",
      "100us,,DC,\nV [V],I [A],X,Y\n1,100,1,20\n10,50,10,x2\n",
      "row 4, column D (DC, Y): 'x2' is not a number",
    ],
    [
      "a curve name without a time unit",
      "10,,DC,\n1,100,1,20\n10,50,10,2\n",
      "row 1, column A: curve name '10' has no time unit (write for example '10 us' or '10 ms')",
    ],
    [
      "an unreadable curve name",
      "100us,,fast,\n1,100,1,20\n10,50,10,2\n",
      "row 1, column C: 'fast' is not a pulse width (write for example 100us, 1 ms, 1e-3 or DC)",
    ],
    [
      "a curve name over the Y column",
      "100us,DC\n1,100\n10,50\n",
      "row 1, column B: curve name 'DC' stands above the Y column of a pair; each curve takes two columns, named above the first (A)",
    ],
    [
      "values under no curve name",
      "100us,,,\n1,100,1,20\n10,50,10,2\n",
      "row 2, column C: values under no curve name: name the curve in row 1",
    ],
    [
      "two curves with the same width",
      "100us,,0.1 ms,\n1,100,1,20\n10,50,10,2\n",
      "row 1, column C: '0.1 ms' is the same pulse width as '100us' (column A)",
    ],
    [
      "an axis that is not voltage or current",
      "100us,,DC,\nX [s],Y,X,Y\n1,100,1,20\n10,50,10,2\n",
      "row 2, column A (X [s]): unit 's' does not fit a voltage (expected V)",
    ],
    [
      "a curve with no points",
      "100us,,DC,\n1,100,,\n10,50,,\n",
      "row 1, column C: the DC curve has no points; a curve needs at least 2",
    ],
  ])("paired: %s", (_, text, message) => {
    expect(errorsOf(text)).toContain(message);
  });

  test("collects every problem, sorted by row, and returns no curves", () => {
    const text = "width,V_DS [V],I_D [A]\n1ms,x,10\n1ms,2,y\nfast,3,0\n1ms,2,4\n";
    expect(errorsOf(text)).toEqual([
      "row 2, column V_DS [V]: 'x' is not a number",
      "row 3, column I_D [A]: 'y' is not a number",
      "row 4, column width: 'fast' is not a pulse width (write for example 100us, 1 ms, 1e-3 or DC)",
      "row 4, column I_D [A]: '0' must be greater than 0",
    ]);
  });

  test("lists at most 50 problems and says how many more there were", () => {
    const rows = Array.from({ length: 60 }, (_, k) => `1ms,${k + 1},bad`);
    const messages = errorsOf(`width,V,I\n${rows.join("\n")}\n`);
    expect(messages).toHaveLength(51);
    expect(messages[0]).toBe("row 2, column I: 'bad' is not a number");
    expect(messages[50]).toBe("10 more problems not listed");
  });

  test("each error carries row, column and reason as separate fields", () => {
    const result = parseCurveSetCsv("width,V_DS [V],I_D [A]\n1ms,1,10\n1ms,2,abc\n");
    expect(result.ok ? [] : result.errors).toEqual([
      {
        row: 3,
        column: "I_D [A]",
        reason: "'abc' is not a number",
        message: "row 3, column I_D [A]: 'abc' is not a number",
      },
    ]);
  });
});

describe("parseCurveSetCsv limits", () => {
  test("rejects a file above 5 MB, counted in bytes of UTF-8", () => {
    // derived: "µ" is 2 bytes in UTF-8, so 2 600 000 of them and the 10-byte header make 5 200 010 bytes (5.2 MB,
    // SI) while the string has 2 600 010 characters, under the 5 000 000-byte limit
    const text = `width,V,I\n${"µ".repeat(2_600_000)}`;
    expect(text.length).toBeLessThan(MAX_CSV_BYTES);
    expect(errorsOf(text)).toEqual(["the file is 5.2\u2009MB; the limit is 5\u2009MB"]);
  });

  test("accepts a file just at the limit", () => {
    const body = "width,V,I\n1ms,1,10\n1ms,2,5\n";
    expect(parseCurveSetCsv(body, { maxBytes: body.length }).ok).toBe(true);
    // derived: the body is 10 + 9 + 8 = 27 bytes of ASCII
    expect(body.length).toBe(27);
    expect(errorsOf(body, body.length - 1)[0]).toBe("the file is 27\u2009B; the limit is 26\u2009B");
  });

  test("rejects NUL bytes and binary-looking content", () => {
    expect(errorsOf("width,V,I\n1ms,1\u0000,10\n")[0]).toMatch(/^the file contains NUL bytes/);
    const binary = Array.from({ length: 200 }, (_, k) =>
      String.fromCharCode(1 + (k % 7), 65 + (k % 26)),
    ).join("");
    expect(errorsOf(binary)[0]).toMatch(
      /^the file does not look like text \(200 control or undecodable characters\)/,
    );
    expect(errorsOf(`width,V,I\n${"\uFFFD".repeat(20)}`)[0]).toMatch(/^the file does not look like text/);
  });

  test("is total: any text gives a result, never an exception", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 300 }), (text) => {
        const result = parseCurveSetCsv(text);
        expect(typeof result.ok).toBe("boolean");
      }),
      { numRuns: 500 },
    );
  });
});

describe("examples and help", () => {
  test("both examples hold the same invented curves where they overlap, and pass the engine's findings", () => {
    const long = parsed(exampleLongCsv).curves;
    const paired = parsed(examplePairedCsv).curves;
    for (const curve of paired) {
      const same = long.find((c) => c.duration === curve.duration);
      expect(same?.points).toEqual(curve.points);
    }
    // The engine's quality findings (findings.ts): no crossing, no slope steeper than a resistor, sorted.
    expect(findCurveSetIssues(digitisedCurveSet(long))).toEqual([]);
    expect(findCurveSetIssues(digitisedCurveSet(paired))).toEqual([]);
  });

  test("the help names both shapes, the separators and the limit", () => {
    const help = curveCsvHelp.join(" ");
    for (const words of ["5 MB", "Table form", "Paired columns", "semicolon", "Decimal commas", "DC"]) {
      expect(help).toContain(words);
    }
  });
});
