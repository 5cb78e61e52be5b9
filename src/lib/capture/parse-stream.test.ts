import { createHash } from "node:crypto";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { AppError } from "@/lib/errors";
import { type CaptureMappingInput, captureMappingSchema } from "./parse";
import { createCaptureParser, parseCaptureStream, parseCaptureText } from "./parse-stream";

const mapping = (input: Partial<CaptureMappingInput> = {}) =>
  captureMappingSchema.parse({ time: 0, voltage: 1, current: 2, ...input });

/** The AppError a parse throws, with its one issue. */
function failure(run: () => unknown) {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(AppError);
    const e = error as AppError;
    expect(e.code).toBe("invalid:csv");
    return {
      message: e.message,
      issue: (e.details as { issues: { row: number; column: string }[] }).issues[0],
    };
  }
  throw new Error("expected the parse to fail");
}

// A capture file as a scope writes it: preamble (with non-ASCII units), a header, CRLF line ends.
const scopeFile = [
  "Instrument,Bench scope Ω-7",
  "Sample Interval,2e-07",
  "Vertical Units,µV",
  "",
  "Time (s),CH1 (V),CH2 (A)",
  ...Array.from({ length: 400 }, (_, k) => {
    const t = (k - 100) * 2e-7;
    return `${t.toExponential(6)},${(48 - k * 0.05).toFixed(3)},${(Math.sin(k / 9) * 12.5).toFixed(4)}`;
  }),
  "",
].join("\r\n");

describe("parseCaptureText", () => {
  it("reads the mapped columns exactly as Number() reads the cells, after the preamble and header", () => {
    const parsed = parseCaptureText(scopeFile, mapping());
    const rows = scopeFile.split("\r\n").slice(5, 405);
    expect(parsed.t.length).toBe(400);
    expect(parsed.firstRow).toBe(6);
    expect(parsed.mapping).toMatchObject({ skipRows: 4, header: true, delimiter: "," });
    rows.forEach((row, k) => {
      const [t, v, i] = row.split(",").map(Number);
      expect([parsed.t[k], parsed.v[k], parsed.i[k]]).toEqual([t, v, i]);
    });
  });

  it("gives identical samples however the bytes are cut into chunks", () => {
    const whole = parseCaptureText(scopeFile, mapping());
    const bytes = new TextEncoder().encode(scopeFile);
    for (const size of [1, 2, 3, 5, 7, 13, 64, 1000]) {
      const parser = createCaptureParser(mapping());
      for (let k = 0; k < bytes.length; k += size) parser.push(bytes.subarray(k, k + size));
      const cut = parser.end();
      expect(Buffer.from(cut.t.buffer, cut.t.byteOffset, cut.t.byteLength)).toEqual(
        Buffer.from(whole.t.buffer, whole.t.byteOffset, whole.t.byteLength),
      );
      expect(Array.from(cut.v)).toEqual(Array.from(whole.v));
      expect(Array.from(cut.i)).toEqual(Array.from(whole.i));
    }
  });

  it("reads any double written in its shortest form exactly (fast path and fallback alike)", () => {
    const finite = fc.double({ noNaN: true, noDefaultInfinity: true });
    fc.assert(
      fc.property(fc.array(fc.tuple(finite, finite), { minLength: 2, maxLength: 40 }), (values) => {
        const lines = values.map(([v, i], k) => `${k},${String(v)},${String(i)}`);
        const parsed = parseCaptureText(lines.join("\n"), mapping({ skipRows: 0 }));
        expect(Array.from(parsed.v)).toEqual(values.map(([v]) => v + 0));
        expect(Array.from(parsed.i)).toEqual(values.map(([, i]) => i + 0));
      }),
      { numRuns: 200 },
    );
  });

  it("reads numbers in every notation scopes and spreadsheets write", () => {
    const cells = [
      "+1.5E+3",
      ".5",
      "5.",
      "-0.000123",
      "007",
      "1e-300",
      "12345678901234567890",
      " 2.5 ",
      '"3.25"',
    ];
    const text = cells.map((cell, k) => `${k},${cell},1`).join("\n");
    const parsed = parseCaptureText(text, mapping({ skipRows: 0 }));
    expect(Array.from(parsed.v)).toEqual([
      1500,
      0.5,
      5,
      -0.000123,
      7,
      1e-300,
      Number("12345678901234567890"),
      2.5,
      3.25,
    ]);
  });

  it("reads decimal commas with ';' and with tabs", () => {
    for (const sep of [";", "\t"]) {
      const text = ["Zeit (ms);U (V);I (A)", "0,5;12,25;-1,5", "0,75;12,5;1,5E-1"]
        .join("\n")
        .replaceAll(";", sep);
      const parsed = parseCaptureText(text, mapping());
      expect(Array.from(parsed.t)).toEqual([0.5, 0.75]);
      expect(Array.from(parsed.v)).toEqual([12.25, 12.5]);
      expect(Array.from(parsed.i)).toEqual([-1.5, 0.15]);
    }
  });

  it("applies value = raw·scale + offset per channel and the time scale", () => {
    const text = "0,1,2\n10,3,-4\n";
    const parsed = parseCaptureText(
      text,
      mapping({ skipRows: 0, timeScale: 1e-6, vScale: 10, vOffset: -0.5, iScale: 1e-3, iOffset: 0.25 }),
    );
    expect(Array.from(parsed.t)).toEqual([0, 10 * 1e-6]);
    expect(Array.from(parsed.v)).toEqual([1 * 10 - 0.5, 3 * 10 - 0.5]);
    expect(Array.from(parsed.i)).toEqual([2 * 1e-3 + 0.25, -4 * 1e-3 + 0.25]);
  });

  it("uses the given rows, header and separator over detection, and columns in any order", () => {
    const text = ["skip me", "and me", "I;flag;V;time", "1,5;ok;40;0", "1,75;ok,late;41;1"].join("\n");
    const parsed = parseCaptureText(
      text,
      mapping({ skipRows: 2, header: true, delimiter: ";", time: 3, voltage: 2, current: 0 }),
    );
    expect(Array.from(parsed.t)).toEqual([0, 1]);
    expect(Array.from(parsed.v)).toEqual([40, 41]);
    expect(Array.from(parsed.i)).toEqual([1.5, 1.75]);
  });

  it("skips blank lines, reads CR-only line ends and a last line without a line end", () => {
    const lf = "\uFEFFt,v,i\n\n0,1,2\n  \n1,2,3\n2,3,4";
    const expected = { t: [0, 1, 2], v: [1, 2, 3], i: [2, 3, 4] };
    for (const text of [lf, lf.replaceAll("\n", "\r"), lf.replaceAll("\n", "\r\n")]) {
      const parsed = parseCaptureText(text, mapping());
      expect({ t: Array.from(parsed.t), v: Array.from(parsed.v), i: Array.from(parsed.i) }).toEqual(expected);
    }
  });

  it("ignores what other columns hold, quoted separators included", () => {
    const text = ['"note, free text",0,1,2', "n/a,1,2,3"].join("\n");
    const parsed = parseCaptureText(text, mapping({ skipRows: 0, time: 1, voltage: 2, current: 3 }));
    expect(Array.from(parsed.t)).toEqual([0, 1]);
  });

  it("grows its arrays past a size hint that was too small", () => {
    const text = Array.from({ length: 5000 }, (_, k) => `${k},${k},${-k}`).join("\n");
    const parsed = parseCaptureText(text, mapping({ skipRows: 0 }), { sizeHint: 10 });
    expect(parsed.t.length).toBe(5000);
    expect(parsed.i[4999]).toBe(-4999);
  });

  it("names the row and column of a non-numeric or empty cell", () => {
    const bad = scopeFile.replace("47.950", "47.9S0");
    const { message, issue } = failure(() => parseCaptureText(bad, mapping()));
    expect(issue).toMatchObject({ row: 7, column: "CH1 (V)" });
    expect(message).toBe("The capture was not accepted: row 7, column CH1 (V): '47.9S0' is not a number");
    expect(failure(() => parseCaptureText("0,1,2\n1,,3\n", mapping({ skipRows: 0 }))).issue).toMatchObject({
      row: 2,
      column: "B",
      reason: "the cell is empty",
    });
    expect(failure(() => parseCaptureText("0,1,2\n1,NaN,3\n", mapping({ skipRows: 0 }))).issue.row).toBe(2);
    expect(failure(() => parseCaptureText("0,1,2\n1,1e999,3\n", mapping({ skipRows: 0 }))).issue.row).toBe(2);
  });

  it("names the row where a mapped column is missing", () => {
    const { issue } = failure(() => parseCaptureText("0,1,2\n1,2\n", mapping({ skipRows: 0 })));
    expect(issue).toMatchObject({ row: 2, column: "C", reason: "the row has no such column" });
  });

  it("refuses a time that does not strictly increase, naming its row", () => {
    const { issue, message } = failure(() => parseCaptureText("t,v,i\n0,1,2\n1,1,2\n1,1,2\n", mapping()));
    expect(issue).toMatchObject({ row: 4, column: "t" });
    expect(message).toMatch(/does not increase/);
    expect(failure(() => parseCaptureText("t,v,i\n2,1,2\n1,1,2\n", mapping())).issue.row).toBe(3);
  });

  it("refuses more samples than the limit, and fewer than two", () => {
    const text = Array.from({ length: 101 }, (_, k) => `${k},1,1`).join("\n");
    const { issue, message } = failure(() =>
      parseCaptureText(text, mapping({ skipRows: 0 }), { maxSamples: 100 }),
    );
    expect(issue.row).toBe(101);
    expect(message).toMatch(/more than 100 samples/);
    expect(parseCaptureText(text, mapping({ skipRows: 0 }), { maxSamples: 101 }).t.length).toBe(101);
    expect(failure(() => parseCaptureText("t,v,i\n0,1,2\n", mapping())).message).toMatch(
      /at least two samples/,
    );
  });

  it("refuses UTF-16, binary files, endless lines and files without data", () => {
    const utf16 = new Uint8Array([0xff, 0xfe, 0x30, 0, 0x2c, 0]);
    const parser = createCaptureParser(mapping());
    parser.push(utf16);
    expect(failure(() => parser.end()).message).toMatch(/UTF-16/);
    expect(failure(() => parseCaptureText("0,1,2\n1,\u0000,3\n", mapping())).message).toMatch(/NUL/);
    const endless = `t,v,i\n${"1".repeat(2 << 20)}`;
    expect(failure(() => parseCaptureText(endless, mapping({ skipRows: 0, header: true }))).message).toMatch(
      /1 MB/,
    );
    expect(failure(() => parseCaptureText("just words\nand more\n", mapping())).message).toMatch(/No rows/);
  });
});

describe("parseCaptureStream", () => {
  it("parses chunks from a stream and hands every byte to onChunk", async () => {
    const bytes = Buffer.from(scopeFile);
    async function* chunks() {
      for (let k = 0; k < bytes.length; k += 997) yield bytes.subarray(k, k + 997);
    }
    const hash = createHash("sha256");
    const parsed = await parseCaptureStream(chunks(), mapping(), { onChunk: (c) => hash.update(c) });
    expect(hash.digest("hex")).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(parsed.bytes).toBe(bytes.length);
    expect(Array.from(parsed.t)).toEqual(Array.from(parseCaptureText(scopeFile, mapping()).t));
  });
});
