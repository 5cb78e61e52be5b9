// Long file: one short case per column, unit and problem the measurement table reader handles.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  MAX_MEASUREMENT_ROWS,
  type MeasurementRow,
  measurementRowSchema,
  parseMeasurementPaste,
} from "./measurements";

/** The fields of a row without its source number and errors, for comparing values. */
function pulse(row: MeasurementRow) {
  const { row: _row, errors: _errors, ...rest } = row;
  return rest;
}

function messages(row: MeasurementRow): string[] {
  return row.errors.map((error) => error.message);
}

describe("parseMeasurementPaste: separators and headers", () => {
  test("reads a tab-separated sheet with units in the header and decimal commas", () => {
    const paste = [
      "Label\tV_DS [V]\tI_D [A]\tt_p [us]",
      "pre-charge A\t48\t12,5\t150",
      "pre-charge B\t47,6\t13,1\t142,5",
    ].join("\n");
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(result.hasHeader).toBe(true);
    expect(result.columns).toEqual({
      label: 0,
      voltage: 1,
      current: 2,
      width: 3,
      ignored: [],
      unread: [],
      headers: ["Label", "V_DS [V]", "I_D [A]", "t_p [us]"],
    });
    expect(result.rows.map(pulse)).toEqual([
      { label: "pre-charge A", kind: "rect", v: 48, i: 12.5, duration: 150e-6 },
      { label: "pre-charge B", kind: "rect", v: 47.6, i: 13.1, duration: 142.5e-6 },
    ]);
    expect(result.rows.map((row) => row.row)).toEqual([2, 3]);
  });

  test("reads a semicolon-separated sheet with the units written in the values", () => {
    const paste = "Name;Vds;Id;Width;Shape\nshort 1;48 V;12,5A;2,5 ms;tri\nshort 2;36V;850 mA;150 µs;rect\n";
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(result.rows.map(pulse)).toEqual([
      { label: "short 1", kind: "triangle", v: 48, i: 12.5, duration: 2.5e-3 },
      { label: "short 2", kind: "rect", v: 36, i: 0.85, duration: 150e-6 },
    ]);
  });

  test("reads a comma-separated paste without header as V, I, width, shape, period, count", () => {
    const result = parseMeasurementPaste("48,12.5,150us\n36,20,1ms,triangle,10ms,5\n24,3.3,2e-3,,0.5\n");
    expect(result.hasHeader).toBe(false);
    expect(result.errors).toEqual([]);
    expect(result.columns).toEqual({
      voltage: 0,
      current: 1,
      width: 2,
      shape: 3,
      period: 4,
      count: 5,
      ignored: [],
      unread: [],
      headers: ["A", "B", "C", "D", "E", "F"],
    });
    expect(result.rows.map(pulse)).toEqual([
      { label: "P1", kind: "rect", v: 48, i: 12.5, duration: 150e-6 },
      { label: "P2", kind: "triangle", v: 36, i: 20, duration: 1e-3, repeat: { period: 10e-3, count: 5 } },
      { label: "P3", kind: "rect", v: 24, i: 3.3, duration: 2e-3, repeat: { period: 0.5 } },
    ]);
  });

  test("names a headerless cell by its field and ignores cells beyond the six columns, with a note", () => {
    const result = parseMeasurementPaste("48;x;1 ms;;;;bench 3\n");
    expect(messages(result.rows[0])).toEqual(["row 1, column I: 'x' is not a number"]);
    expect(result.columns.ignored).toEqual([
      {
        index: 6,
        header: "G",
        note: "without a header only V, I, width, shape, period and count are read",
      },
    ]);
  });

  test("scales bare numbers by the header unit with one exponent and reads values with their own unit as written", () => {
    const paste =
      "V (kV)\tId (mA)\tpulse width / ms\n0,4\t850\t1,5\n0.6 kV\t1.2 A\t40 us\n0,048\t1,5e3\t8e-2\n";
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(result.rows.map((row) => [row.v, row.i, row.duration])).toEqual([
      [400, 0.85, 1.5e-3],
      [600, 1.2, 40e-6],
      [48, 1.5, 8e-5],
    ]);
  });

  test("reads 'Pulse' as the label, and as the width when it carries a time unit", () => {
    expect(parseMeasurementPaste("Pulse;V;I;tp\nA;48;10;1ms\n").columns).toMatchObject({
      label: 0,
      width: 3,
    });
    const width = parseMeasurementPaste("Name;V;I;Pulse [us]\nA;48;10;80\n");
    expect(width.columns).toMatchObject({ label: 0, width: 3 });
    expect(width.rows[0].duration).toBe(8e-5);
  });

  test("reads quoted cells with separators inside and trims trailing spaces", () => {
    const paste = 'label,V,I,tp\n"inrush, cold start" , 48 ,12 ,"150 us"  \n';
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(pulse(result.rows[0])).toEqual({
      label: "inrush, cold start",
      kind: "rect",
      v: 48,
      i: 12,
      duration: 150e-6,
    });
  });

  test("recognises common header variants", () => {
    const paste = "Pulse name;U [V];I_peak [A];Pulse width [ms];Pulse shape;Rep. period [ms];No. of pulses\n";
    const result = parseMeasurementPaste(`${paste.replace("No. of pulses", "Pulses")}P;12;4;1;ramp;5;3\n`);
    expect(result.errors).toEqual([]);
    expect(result.columns).toMatchObject({
      label: 0,
      voltage: 1,
      current: 2,
      width: 3,
      shape: 4,
      period: 5,
      count: 6,
    });
    expect(pulse(result.rows[0])).toEqual({
      label: "P",
      kind: "triangle",
      v: 12,
      i: 4,
      duration: 1e-3,
      repeat: { period: 5e-3, count: 3 },
    });
  });

  test("reads 'Id' as the drain current unless another column is the current, then as the label", () => {
    const asCurrent = parseMeasurementPaste("Name,V,Id,tp\nA,48,12,1ms\n");
    expect(asCurrent.columns).toMatchObject({ label: 0, current: 2 });
    const asLabel = parseMeasurementPaste("ID,V,I,tp\nbench-7,48,12,1ms\n");
    expect(asLabel.columns).toMatchObject({ label: 0, current: 2 });
    expect(asLabel.rows[0].label).toBe("bench-7");
    const underscored = parseMeasurementPaste("id,V,I_D,tp\nA,48,12,1ms\n");
    expect(underscored.columns).toMatchObject({ label: 0, current: 2 });
  });
});

describe("parseMeasurementPaste: repetition", () => {
  test("turns a frequency into a period, with the unit in the header or in the value", () => {
    const paste =
      "V\tI\ttp [us]\tf [kHz]\tn\n48\t10\t100\t1\t\n48\t10\t100\t2 kHz\tcont\n48\t10\t100\t50 Hz\t25\n";
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(result.columns.frequency).toBe(3);
    expect(result.rows.map((row) => row.repeat)).toEqual([
      { period: 1e-3 },
      { period: 5e-4 },
      { period: 0.02, count: 25 },
    ]);
  });

  test("takes an empty count, 'cont', 'continuous' and '∞' for a continuous train, a number for a counted one", () => {
    const counts = ["", "cont", "Continuous", "∞", "1", "12", "1e3"];
    const paste = `V;I;width;period;count\n${counts.map((n) => `48;10;1ms;10ms;${n}`).join("\n")}`;
    const result = parseMeasurementPaste(paste);
    expect(result.rows.map((row) => row.repeat?.count)).toEqual([
      undefined,
      undefined,
      undefined,
      undefined,
      1,
      12,
      1000,
    ]);
    expect(result.rows.every((row) => row.errors.length === 0 && row.repeat?.period === 0.01)).toBe(true);
  });

  test("without period or frequency a row is a single pulse; a count above 1 or 'cont' is then an error", () => {
    const result = parseMeasurementPaste(
      "V;I;width;period;count\n48;10;1ms;;\n48;10;1ms;;1\n48;10;1ms;;5\n48;10;1ms;;cont\n",
    );
    expect(result.rows.slice(0, 2).map((row) => [row.repeat, row.errors])).toEqual([
      [undefined, []],
      [undefined, []],
    ]);
    expect(messages(result.rows[2])).toEqual([
      "row 4, column count: 5 pulses need a period or a frequency to repeat at",
    ]);
    expect(messages(result.rows[3])).toEqual([
      "row 5, column count: a continuous train needs a period or a frequency to repeat at",
    ]);
  });

  test("refuses counts that are not whole numbers of at least 1", () => {
    const result = parseMeasurementPaste(
      "V;I;width;T;N\n48;10;1ms;10ms;0\n48;10;1ms;10ms;2,5\n48;10;1ms;10ms;many\n",
    );
    expect(result.rows.map((row) => row.errors[0]?.reason)).toEqual([
      "'0': the count must be 1 or more",
      "'2,5' is not a whole number of pulses (or 'cont' for a continuous train)",
      "'many' is not a whole number of pulses (or 'cont' for a continuous train)",
    ]);
  });

  test("asks for a period longer than the pulse, naming the period or frequency cell", () => {
    const result = parseMeasurementPaste("V,I,tp,T,f\n48,10,2ms,1ms,\n48,10,2ms,,1kHz\n48,10,2ms,2ms,\n");
    expect(result.rows.map(messages)).toEqual([
      ["row 2, column T: the period (1\u2009ms) must be longer than the pulse (2\u2009ms)"],
      ["row 3, column f: the period (1\u2009ms) must be longer than the pulse (2\u2009ms)"],
      ["row 4, column T: the period (2\u2009ms) must be longer than the pulse (2\u2009ms)"],
    ]);
  });

  test("with both a period and a frequency, uses the period when they agree within 1 % and refuses otherwise", () => {
    const result = parseMeasurementPaste(
      "V;I;tp;Period [ms];Freq [Hz]\n48;10;1ms;10,0;99,8\n48;10;1ms;10;50\n",
    );
    expect(result.rows[0].repeat).toEqual({ period: 0.01 });
    expect(result.rows[0].errors).toEqual([]);
    expect(messages(result.rows[1])).toEqual([
      "row 3, column Freq [Hz]: '50' means a period of 20\u2009ms, which disagrees with '10' in Period [ms]; keep one of them",
    ]);
  });
});

describe("parseMeasurementPaste: shapes", () => {
  test("reads rect, rectangle, square, tri, triangle and ramp in any case; an empty cell is rect", () => {
    const words = ["rect", "Rectangle", "SQUARE", "", "tri", "Triangle", "ramp"];
    const result = parseMeasurementPaste(`V,I,tp,shape\n${words.map((w) => `48,10,1ms,${w}`).join("\n")}`);
    expect(result.rows.map((row) => row.kind)).toEqual([
      "rect",
      "rect",
      "rect",
      "rect",
      "triangle",
      "triangle",
      "triangle",
    ]);
  });

  test("names the cell of an unknown shape word", () => {
    const result = parseMeasurementPaste("V,I,tp,Shape\n48,10,1ms,sine\n");
    expect(messages(result.rows[0])).toEqual([
      "row 2, column Shape: 'sine' is not a pulse shape (write rect or triangle)",
    ]);
    expect(result.rows[0].kind).toBe("rect");
  });
});

describe("parseMeasurementPaste: row-level problems", () => {
  test("keeps every row in the preview, skips blank lines and names row and column of each problem", () => {
    const paste = [
      "Label;V_DS [V];I_D [A];Width [us]",
      "ok 1;48;12;150",
      "",
      "bad current;48;abc;150",
      "   ",
      "negative;-5;12;150",
      "missing;48;12",
      "zero width;48;12;0",
      "dc;48;12;DC",
      "ok 2;36;2,5;80",
    ].join("\n");
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(result.rows.map((row) => [row.row, row.label])).toEqual([
      [2, "ok 1"],
      [4, "bad current"],
      [6, "negative"],
      [7, "missing"],
      [8, "zero width"],
      [9, "dc"],
      [10, "ok 2"],
    ]);
    expect(result.rows.flatMap(messages)).toEqual([
      "row 4, column I_D [A]: 'abc' is not a number",
      "row 6, column V_DS [V]: '-5' must be greater than 0",
      "row 7, column Width [us]: the cell is empty",
      "row 8, column Width [us]: '0' must be greater than 0",
      "row 9, column Width [us]: 'DC': a measured pulse needs a time, not DC",
    ]);
    expect(result.rows[1].i).toBeNaN();
    expect(result.rows[6]).toMatchObject({ v: 36, i: 2.5, duration: 80e-6, errors: [] });
  });

  test("reports every bad cell of a row, and a value with the wrong unit", () => {
    const result = parseMeasurementPaste("V;I;tp\n48 A;1,2,3;fast\n");
    expect(result.rows[0].errors.map((error) => [error.column, error.reason])).toEqual([
      ["V", "'48 A': expected unit 'V', got 'A'"],
      ["I", "'1,2,3' is not a number (use '.' for decimals)"],
      ["tp", "'fast' is not a time (write for example 150 µs, 2.5 ms or 1e-3)"],
    ]);
  });

  test("refuses a decimal comma in a comma-separated paste (quoted, it is still ambiguous)", () => {
    const result = parseMeasurementPaste('V,I,tp\n48,"12,5",1ms\n');
    expect(result.rows[0].errors[0].reason).toBe("'12,5' is not a number (use '.' for decimals)");
  });

  test("numbers default labels by position among pulse rows and refuses labels over 80 characters", () => {
    const long = "x".repeat(81);
    const result = parseMeasurementPaste(
      `Label\tV\tI\ttp\n\t48\t1\t1ms\n\n${long}\t48\t1\t1ms\n\t48\t1\t1ms\n`,
    );
    expect(result.rows.map((row) => row.label)).toEqual(["P1", long, "P3"]);
    expect(messages(result.rows[1])).toEqual([
      "row 4, column Label: the label has 81 characters; the limit is 80",
    ]);
  });
});

describe("parseMeasurementPaste: real-looking pastes", () => {
  test("reads an Excel copy: tabs, CRLF, a trailing tab on every line and a final line end", () => {
    const paste =
      "Pulse\tV_DS [V]\tI_D [A]\tWidth [ms]\tShape\tPeriod [ms]\tCount\t\r\n" +
      "inrush cold\t48,2\t31,5\t1,8\ttriangle\t\t\t\r\n" +
      "inrush warm\t48,0\t29,7\t1,9\ttriangle\t\t\t\r\n" +
      "overload train\t24,6\t18,0\t0,5\trect\t20\t8\t\r\n" +
      "retry\t24,6\t18,0\t0,5\trect\t100\tcont\t\r\n";
    const result = parseMeasurementPaste(paste);
    expect(result.errors).toEqual([]);
    expect(result.columns.ignored).toEqual([]);
    expect(result.rows.map(pulse)).toEqual([
      { label: "inrush cold", kind: "triangle", v: 48.2, i: 31.5, duration: 1.8e-3 },
      { label: "inrush warm", kind: "triangle", v: 48, i: 29.7, duration: 1.9e-3 },
      {
        label: "overload train",
        kind: "rect",
        v: 24.6,
        i: 18,
        duration: 0.5e-3,
        repeat: { period: 0.02, count: 8 },
      },
      { label: "retry", kind: "rect", v: 24.6, i: 18, duration: 0.5e-3, repeat: { period: 0.1 } },
    ]);
  });

  test("reads a scope measurement table, leaving out the columns it does not know only when told to", () => {
    const paste = [
      "Acq #,Source,Vds max,Id max,+Width,Mean,Std dev",
      "1,C1/C3,48.4 V,11.9 A,148.2 us,5.06 A,0.41 A",
      "2,C1/C3,48.1 V,12.2 A,151.0 us,5.11 A,0.39 A",
      "3,C1/C3,48.3 V,12.0 A,149.6 us,5.08 A,0.40 A",
    ].join("\r\n");
    const unmapped = parseMeasurementPaste(paste);
    expect(unmapped.errors.map((e) => e.message)).toEqual([
      "column Source: the column is not read; choose what it holds under Columns, or leave it out",
      "column Mean: the column is not read; choose what it holds under Columns, or leave it out",
      "column Std dev: the column is not read; choose what it holds under Columns, or leave it out",
    ]);
    expect(unmapped.rows).toHaveLength(3);
    const result = parseMeasurementPaste(paste, { 1: "skip", 5: "skip", 6: "skip" });
    expect(result.errors).toEqual([]);
    expect(result.columns).toMatchObject({
      label: 0,
      voltage: 2,
      current: 3,
      width: 4,
      unread: [],
      ignored: [
        { index: 1, header: "Source", note: "left out" },
        { index: 5, header: "Mean", note: "left out" },
        { index: 6, header: "Std dev", note: "left out" },
      ],
    });
    expect(result.rows.map(pulse)).toEqual([
      { label: "1", kind: "rect", v: 48.4, i: 11.9, duration: 148.2e-6 },
      { label: "2", kind: "rect", v: 48.1, i: 12.2, duration: 151e-6 },
      { label: "3", kind: "rect", v: 48.3, i: 12, duration: 149.6e-6 },
    ]);
  });

  test("lists a column without header only when it holds something", () => {
    const result = parseMeasurementPaste("V;I;tp;;\n48;10;1ms;;\n48;10;1ms;;probe 2\n");
    expect(result.columns.ignored).toEqual([{ index: 4, header: "E", note: "no header names this column" }]);
    expect(result.columns.unread).toEqual(result.columns.ignored);
  });

  test("reads issue 12's 'repeat period' column as the period: a 50 ms overload train is a train", () => {
    const result = parseMeasurementPaste(
      "label\tV_DS [V]\tI_D [A]\twidth\trepeat period\tcount\nO1\t24\t18\t2 ms\t50 ms\t10\n",
    );
    expect(result.errors).toEqual([]);
    expect(result.rows.map(pulse)).toEqual([
      { label: "O1", kind: "rect", v: 24, i: 18, duration: 2e-3, repeat: { period: 0.05, count: 10 } },
    ]);
    for (const [name, field] of [
      ["Pulse period [ms]", "period"],
      ["Cycle time", "period"],
      ["Repeat rate [Hz]", "frequency"],
      ["PRR", "frequency"],
      ["Repeats", "count"],
      ["Cycles", "count"],
    ] as const) {
      expect(parseMeasurementPaste(`V;I;tp;${name}\n48;10;1ms;5\n`).columns[field], name).toBe(3);
    }
    expect(parseMeasurementPaste("V;I;t_on [us]\n48;10;150\n").columns.width).toBe(2);
  });

  test("blocks a column that looks like repetition and is not read, with a clear message", () => {
    const result = parseMeasurementPaste("V;I;tp;rep. spacing time\n48;10;1ms;50\n");
    expect(result.errors.map((e) => e.message)).toEqual([
      "column rep. spacing time: the column is not read: it looks like repetition, and reading the pulses " +
        "without it would check a train as a single pulse; choose what it holds under Columns, or leave it out",
    ]);
    expect(result.columns.unread?.map((c) => c.index)).toEqual([3]);
    const mapped = parseMeasurementPaste("V;I;tp;rep. spacing time [ms]\n48;10;1ms;50\n", { 3: "period" });
    expect(mapped.errors).toEqual([]);
    expect(mapped.rows[0].repeat).toEqual({ period: 0.05 });
  });

  test("a mapping overrides the header and the headerless order", () => {
    const swapped = parseMeasurementPaste("A;B;C\n1ms;48;10\n", { 0: "width", 1: "voltage", 2: "current" });
    expect(swapped.errors).toEqual([]);
    expect(swapped.rows.map(pulse)).toEqual([{ label: "P1", kind: "rect", v: 48, i: 10, duration: 1e-3 }]);
    const headerless = parseMeasurementPaste("48;10;1ms;x\n", { 3: "label" });
    expect(headerless.rows.map((r) => r.label)).toEqual(["x"]);
    expect(parseMeasurementPaste("48;10;1ms;;;;bench 3\n", { 6: "skip" }).errors).toEqual([]);
  });
});

describe("parseMeasurementPaste: problems with the paste as a whole", () => {
  test("says what is missing when the header names no usable columns, and reads no rows", () => {
    const result = parseMeasurementPaste("Board;Probe;Operator\nB-17;P-3;jd\n");
    expect(result.hasHeader).toBe(true);
    expect(result.rows).toEqual([]);
    expect(result.errors.map((error) => error.message)).toEqual([
      "row 1: no voltage column: name one V, V_DS, Vds, U or voltage",
      "row 1: no current column: name one I, I_D, Id, I_peak or current",
      "row 1: no width column: name one width, duration, t_p or pulse width",
    ]);
    expect(result.columns.ignored.map((column) => column.header)).toEqual(["Board", "Probe", "Operator"]);
  });

  test("points out that T is the period when no width column is found", () => {
    const result = parseMeasurementPaste("V;I;T [us]\n48;10;150\n");
    expect(result.errors.map((error) => error.reason)).toEqual([
      "no width column: name one width, duration, t_p or pulse width; 'T [us]' is read as the repetition period",
    ]);
  });

  test("refuses two columns for the same quantity and a header unit that does not fit", () => {
    const twice = parseMeasurementPaste("V,Vds max,I,tp\n48,49,10,1ms\n");
    expect(twice.errors.map((error) => error.message)).toEqual([
      "row 1, column Vds max: a second voltage column besides 'V'; remove or rename one of them",
    ]);
    const unit = parseMeasurementPaste("V,Id [V],tp [ms]\n48,10,1\n");
    expect(unit.errors.map((error) => error.message)).toEqual([
      "row 1, column Id [V]: unit 'V' does not fit a current (expected A)",
    ]);
  });

  test("reports an empty paste, a header without rows, one column only and an unclosed quote", () => {
    expect(parseMeasurementPaste(" \n\n").errors[0].message).toBe("nothing was pasted");
    expect(parseMeasurementPaste("V\tI\ttp\r\n\r\n").errors[0].message).toBe(
      "no pulse rows below the header",
    );
    expect(parseMeasurementPaste("48 12 150us\n36 20 1ms\n").errors[0].message).toBe(
      "only one column was found: separate the columns by tabs, commas or semicolons",
    );
    expect(parseMeasurementPaste('V,I,tp\n"48,10,1ms\n').errors[0].message).toMatch(
      /quoted cell is not closed/,
    );
  });

  test(`reads at most ${MAX_MEASUREMENT_ROWS} pulse rows and says how many were left out`, () => {
    const body = Array.from({ length: MAX_MEASUREMENT_ROWS + 2 }, (_, k) => `${40 + (k % 9)};10;1ms`);
    const result = parseMeasurementPaste(`V;I;tp\n${body.join("\n")}\n`);
    expect(result.rows).toHaveLength(MAX_MEASUREMENT_ROWS);
    expect(result.rows.at(-1)?.row).toBe(MAX_MEASUREMENT_ROWS + 1);
    expect(result.errors.map((error) => error.message)).toEqual([
      "2 more pulse rows after row 1001 were left out: at most 1,000 are read from one paste",
    ]);
  });
});

describe("parseMeasurementPaste and measurementRowSchema agree", () => {
  const positive = (min: number, max: number) =>
    fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
  const row = fc.record({
    v: positive(0.1, 1500),
    i: positive(1e-3, 500),
    duration: positive(1e-7, 10),
    triangle: fc.boolean(),
    periodFactor: fc.option(positive(1.01, 1000), { nil: undefined }),
    count: fc.option(fc.integer({ min: 1, max: 100_000 }), { nil: undefined }),
  });

  test("any pulse written with any separator reads back exactly and passes the save schema", () => {
    fc.assert(
      fc.property(
        fc.array(row, { minLength: 1, maxLength: 20 }),
        fc.constantFrom("\t", ";", ","),
        (rows, sep) => {
          const number = (x: number) => (sep === "," ? String(x) : String(x).replace(".", ","));
          const lines = rows.map((r) => {
            const period = r.periodFactor === undefined ? "" : number(r.duration * r.periodFactor);
            const count = period === "" ? "" : String(r.count ?? "cont");
            const shape = r.triangle ? "triangle" : "rect";
            return [number(r.v), number(r.i), number(r.duration), shape, period, count].join(sep);
          });
          const result = parseMeasurementPaste(
            `V${sep}I${sep}width [s]${sep}shape${sep}period [s]${sep}n\n${lines.join("\n")}`,
          );
          expect(result.errors).toEqual([]);
          result.rows.forEach((parsed, k) => {
            const r = rows[k];
            expect(parsed.errors).toEqual([]);
            expect([parsed.v, parsed.i, parsed.duration, parsed.kind]).toEqual([
              r.v,
              r.i,
              r.duration,
              r.triangle ? "triangle" : "rect",
            ]);
            expect(parsed.repeat?.count).toBe(r.periodFactor === undefined ? undefined : r.count);
            expect(measurementRowSchema.safeParse(pulse(parsed)).success).toBe(true);
          });
        },
      ),
    );
  });
});

describe("measurementRowSchema", () => {
  const valid = {
    label: "P1",
    kind: "rect",
    v: 48,
    i: 12,
    duration: 1e-3,
    repeat: { period: 0.01, count: 3 },
  };

  test("accepts a pulse in SI units, trims the label and ignores unknown keys", () => {
    const parsed = measurementRowSchema.parse({ ...valid, label: "  inrush  ", row: 4 });
    expect(parsed).toEqual({ ...valid, label: "inrush" });
  });

  test("refuses keys that look like repetition beside repeat, so a train is never read as one pulse", () => {
    const result = measurementRowSchema.safeParse({ ...valid, repeatPeriod: 0.05, count: 10 });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => [issue.path.join("."), issue.message])).toEqual([
      [
        "repeatPeriod",
        "'repeatPeriod' is not read: give repetition as repeat: { period, count } (seconds; count optional)",
      ],
      [
        "count",
        "'count' is not read: give repetition as repeat: { period, count } (seconds; count optional)",
      ],
    ]);
  });

  test("refuses physically absurd values with the sanity limit (issue 12: 1 GV × 2.5 kA)", () => {
    const result = measurementRowSchema.safeParse({ ...valid, v: 1e9, i: 2500 });
    expect(result.error?.issues.map((issue) => issue.message)).toEqual([
      "the voltage: 1\u2009GV is above 100\u2009kV, the most a voltage can be here: check the prefix and the unit",
    ]);
    const paste = parseMeasurementPaste("V;I;tp\n1 GV;2.5 kA;1 ms\n48;10;1e-15\n");
    expect(paste.rows.flatMap(messages)).toEqual([
      "row 2, column V: '1 GV': 1\u2009GV is above 100\u2009kV, the most a voltage can be here: check the prefix and the unit",
      "row 3, column tp: '1e-15': 1e-15\u2009s is below 1\u2009ps, the least a time can be here: check the prefix and the unit",
    ]);
  });

  test.each([
    ["an empty label", { label: "   " }, "label"],
    ["an 81-character label", { label: "x".repeat(81) }, "label"],
    ["a waveform kind", { kind: "waveform" }, "kind"],
    ["a NaN voltage", { v: Number.NaN }, "v"],
    ["an infinite current", { i: Number.POSITIVE_INFINITY }, "i"],
    ["a zero width", { duration: 0 }, "duration"],
    ["a period no longer than the pulse", { repeat: { period: 1e-3 } }, "repeat.period"],
    ["a fractional count", { repeat: { period: 0.01, count: 2.5 } }, "repeat.count"],
    ["a count of 0", { repeat: { period: 0.01, count: 0 } }, "repeat.count"],
  ])("refuses %s", (_, change, path) => {
    const result = measurementRowSchema.safeParse({ ...valid, ...change });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => issue.path.join("."))).toContain(path);
  });
});
