import { describe, expect, it } from "vitest";
import { captureLines, captureMappingSchema, isNumericCell, previewCaptureText } from "./parse";

const keysightLike = [
  "Model,PF-4054 (simulated)",
  "Sample Interval,2e-07",
  "Trigger Point,500",
  "",
  "Time (s),CH1 (V),CH2 (A)",
  "-1.0000e-04,48.02,0.013",
  "-0.9998e-04,47.98,-0.008",
  "-0.9996e-04,48.01,0.004",
  "",
].join("\r\n");

describe("previewCaptureText", () => {
  it("finds the preamble, the header, the data and a mapping from units in the header", () => {
    const preview = previewCaptureText(keysightLike, { complete: true });
    expect(preview.delimiter).toBe(",");
    expect(preview.preamble).toEqual([
      "Model,PF-4054 (simulated)",
      "Sample Interval,2e-07",
      "Trigger Point,500",
      "",
    ]);
    expect(preview.headerRow).toBe(4);
    expect(preview.dataRow).toBe(5);
    expect(preview.rows).toEqual([
      ["-1.0000e-04", "48.02", "0.013"],
      ["-0.9998e-04", "47.98", "-0.008"],
      ["-0.9996e-04", "48.01", "0.004"],
    ]);
    expect(preview.columns.map((c) => [c.label, c.unit, c.role, c.scale])).toEqual([
      ["Time (s)", "s", "time", 1],
      ["CH1 (V)", "V", "voltage", 1],
      ["CH2 (A)", "A", "current", 1],
    ]);
    expect(preview.mapping).toEqual({
      skipRows: 4,
      header: true,
      delimiter: ",",
      time: 0,
      voltage: 1,
      current: 2,
      timeScale: 1,
      vScale: 1,
      vOffset: 0,
      iScale: 1,
      iOffset: 0,
    });
    expect(preview.problems).toEqual([]);
  });

  it("reads prefixed units as scales: µs, mV, mA, with ';' and decimal commas", () => {
    const text = [
      "Time (us);U [mV];I [mA]",
      "0,0;48012,5;130",
      "0,2;47990,1;151,5",
      "0,4;47960,0;170,25",
    ].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.delimiter).toBe(";");
    expect(preview.decimalComma).toBe(true);
    expect(preview.mapping).toMatchObject({
      header: true,
      skipRows: 0,
      timeScale: 1e-6,
      vScale: 1e-3,
      iScale: 1e-3,
    });
  });

  it("takes tab-separated rows without a header in order: time, voltage, current", () => {
    const text = [
      "Instrument\tBench scope",
      "Averaging\t4",
      "0,000001\t12,5\t3,25",
      "0,000002\t12,4\t3,5",
    ].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.delimiter).toBe("\t");
    expect(preview.headerRow).toBeNull();
    expect(preview.columns.map((c) => c.label)).toEqual(["Column 1", "Column 2", "Column 3"]);
    expect(preview.mapping).toMatchObject({ skipRows: 2, header: false, time: 0, voltage: 1, current: 2 });
  });

  it("maps CH1 to voltage and CH2 to current by name, wherever they stand", () => {
    const text = ["TIME,CH2,CH1", "0,1.5,40", "1e-7,1.6,39.9"].join("\n");
    expect(previewCaptureText(text, { complete: true }).mapping).toMatchObject({
      time: 0,
      voltage: 2,
      current: 1,
    });
  });

  it("picks the first three named channels of a four-channel export and ignores the rest", () => {
    const text = ["Time,CH1,CH2,CH3,CH4", "0,1,2,3,4", "1e-6,1,2,3,4"].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.mapping).toMatchObject({ time: 0, voltage: 1, current: 2 });
    expect(preview.columns).toHaveLength(5);
  });

  it("falls back to the remaining column for the current when a shunt channel is labelled in volts", () => {
    const text = ["Time (ms),CH1 (V),CH2 (V)", "0,24,0.05", "0.001,23.9,0.06"].join("\n");
    expect(previewCaptureText(text, { complete: true }).mapping).toMatchObject({
      time: 0,
      voltage: 1,
      current: 2,
      timeScale: 1e-3,
      iScale: 1,
    });
  });

  it("does not take a settings line for a header when it does not name every data column", () => {
    const text = ["Model,XR-2", "Sample Interval,2e-07", "0,48,1", "2e-7,47.9,1.2"].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.headerRow).toBeNull();
    expect(preview.mapping).toMatchObject({ skipRows: 2, header: false });
  });

  it("starts the data at the first row when settings are printed beside the first samples", () => {
    const text = [
      "Record Length,4,Points,-2.0e-06,40.1,0.5",
      "Sample Interval,1e-06,s,-1.0e-06,40.0,0.6",
      ",,,0.0e+00,39.8,0.8",
      ",,,1.0e-06,39.5,1.1",
    ].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.dataRow).toBe(0);
    expect(preview.mapping).toMatchObject({ skipRows: 0, header: false, time: 3, voltage: 4, current: 5 });
  });

  it("drops the cut last line of a partial head, and shows at most ten data rows", () => {
    const lines = ["t,v,i", ...Array.from({ length: 30 }, (_, k) => `${k},${k * 2},${k * 3}`)];
    const head = `${lines.join("\n")}\n31,6`;
    const preview = previewCaptureText(head);
    expect(preview.rows).toHaveLength(10);
    expect(preview.rows[0]).toEqual(["0", "0", "0"]);
    expect(previewCaptureText(head, { complete: true }).rows).toHaveLength(10);
  });

  it("keeps a damaged cell among the data rows, and lists it", () => {
    const text = [
      "Time (s),CH1 (V),CH2 (A)",
      "0,48.0,0",
      "1e-6,47.9S0,1.2",
      "2e-6,47.8,1.4",
      "3e-6,47.7,1.5",
    ].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.mapping).toMatchObject({ skipRows: 0, header: true, voltage: 1 });
    expect(preview.rows).toHaveLength(4);
    expect(preview.problems).toEqual(["Row 3, CH1 (V): '47.9S0' is not a number"]);
  });

  it("reports a file without numbers, and one with fewer than three numeric columns", () => {
    const words = previewCaptureText("Dear bench,\nplease find the capture attached.\n", { complete: true });
    expect(words.mapping).toBeNull();
    expect(words.dataRow).toBeNull();
    expect(words.problems[0]).toMatch(/No rows with two or more numbers/);
    const two = previewCaptureText("Time,CH1\n0,1\n1,2\n", { complete: true });
    expect(two.mapping).toBeNull();
    expect(two.problems).toContain("Three numeric columns (time, voltage, current) were not found.");
  });

  it("notes a unit it cannot read and assumes a scale of 1", () => {
    const preview = previewCaptureText("Time (s),CH1 (div),CH2 (A)\n0,1,2\n1,2,3\n", { complete: true });
    expect(preview.problems).toEqual([
      "CH1 (div): unit 'div' is not understood (expected s, V or A, with a prefix if needed); scale 1 assumed",
    ]);
    expect(preview.mapping).toMatchObject({ voltage: 1, vScale: 1 });
  });

  it("guesses the separator by the uploads' rule: ';' in half the lines wins over the preamble's commas", () => {
    const text = [
      "Model,PF-4054",
      "Date,2026-01-02",
      "Time (s);CH1 (V);CH2 (A)",
      "0;48,0;0,5",
      "1e-6;47,9;0,6",
      "2e-6;47,8;0,7",
    ].join("\n");
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.delimiter).toBe(";");
    expect(preview.mapping).toMatchObject({ skipRows: 2, header: true, time: 0, voltage: 1, current: 2 });
  });

  it("reads a byte-order mark and quoted header cells", () => {
    const text = '\uFEFF"Time (s)","CH1 (V)","CH2 (A)"\n"0","1.5","2"\n"1e-6","1.5","2.5"\n';
    const preview = previewCaptureText(text, { complete: true });
    expect(preview.headerRow).toBe(0);
    expect(preview.columns.map((c) => c.label)).toEqual(["Time (s)", "CH1 (V)", "CH2 (A)"]);
    expect(preview.mapping).toMatchObject({ skipRows: 0, header: true });
  });
});

describe("cells and lines", () => {
  it("isNumericCell takes a decimal comma only where ',' does not separate", () => {
    expect(isNumericCell("1,5", ";")).toBe(true);
    expect(isNumericCell("1,5", ",")).toBe(false);
    expect(["-1.5e-3", "+2", ".5", "5.", "1E+06"].every((c) => isNumericCell(c, ","))).toBe(true);
    expect(["", "NaN", "inf", "1e", "1.2.3", "--1"].some((c) => isNumericCell(c, ","))).toBe(false);
  });

  it("captureLines splits CRLF, LF and CR alike and keeps a complete last line", () => {
    expect(captureLines("a\r\nb\rc\nd", true)).toEqual(["a", "b", "c", "d"]);
    expect(captureLines("a\r\nb\rc\nd", false)).toEqual(["a", "b", "c"]);
    expect(captureLines("a\n", false)).toEqual(["a"]);
  });

  it("captureLines drops a byte-order mark, as every CSV reader does", () => {
    expect(captureLines("\uFEFFt,V\r\n1,2\r\n", true)).toEqual(["t,V", "1,2"]);
  });
});

describe("captureMappingSchema", () => {
  it("fills in scales of 1 and offsets of 0", () => {
    expect(captureMappingSchema.parse({ time: 0, voltage: 1, current: 2 })).toEqual({
      header: false,
      time: 0,
      voltage: 1,
      current: 2,
      timeScale: 1,
      vScale: 1,
      vOffset: 0,
      iScale: 1,
      iOffset: 0,
    });
  });

  it("refuses a column used twice, a zero scale, a time scale that is not positive and infinite offsets", () => {
    const base = { time: 0, voltage: 1, current: 2 };
    expect(captureMappingSchema.safeParse({ ...base, current: 1 }).success).toBe(false);
    expect(captureMappingSchema.safeParse({ ...base, iScale: 0 }).success).toBe(false);
    expect(captureMappingSchema.safeParse({ ...base, timeScale: -1e-6 }).success).toBe(false);
    expect(captureMappingSchema.safeParse({ ...base, vOffset: Number.POSITIVE_INFINITY }).success).toBe(
      false,
    );
    expect(captureMappingSchema.safeParse({ ...base, vScale: -10 }).success).toBe(true);
  });
});
