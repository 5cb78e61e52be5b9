import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { decimalPoint, readNumber, readWidth } from "./cell";
import { quantityOfName, splitHeader, unitScale } from "./header";
import { columnLetter, createIssueList, csvIssue } from "./issues";
import {
  detectDelimiter,
  guessDelimiter,
  normaliseText,
  readTable,
  splitLine,
  textProblem,
  utf8ByteLength,
} from "./text";

describe("utf8ByteLength", () => {
  test("agrees with the platform's UTF-8 encoder on any string", () => {
    // Reference: TextEncoder (WHATWG Encoding Standard), which also writes a lone surrogate as U+FFFD.
    fc.assert(
      fc.property(fc.string({ unit: "binary" }), (text) => {
        expect(utf8ByteLength(text)).toBe(new TextEncoder().encode(text).length);
      }),
    );
    expect(utf8ByteLength("µs\uD83D\uDE00\uD800")).toBe(
      new TextEncoder().encode("µs\uD83D\uDE00\uD800").length,
    );
  });
});

describe("textProblem", () => {
  test("accepts ordinary text with tabs, CR, LF and form feeds", () => {
    expect(textProblem("width\tV\r\n1ms\t1\f\n")).toBeNull();
  });

  test("tolerates a few undecodable characters (a Latin-1 µ), not many", () => {
    expect(textProblem(`width,V,I\n${"1\uFFFDs,1,2\n".repeat(8)}`)).toBeNull();
    expect(textProblem(`width,V,I\n${"1\uFFFDs,1,2\n".repeat(9)}`)).toMatch(/does not look like text/);
  });
});

describe("normaliseText and detectDelimiter", () => {
  test("drops the byte-order mark and unifies line ends", () => {
    expect(normaliseText("\uFEFFa\r\nb\rc\n")).toBe("a\nb\nc\n");
  });

  test.each([
    ["a,b\n1,2\n", ","],
    ["a;b\n1,5;2\n", ";"],
    ["a\tb\n1,5\t2\n", "\t"],
    ["a\n1\n", ","],
    ["a;b\n\n\n1;2\n", ";"],
  ])("detects the separator of %j", (text, delimiter) => {
    expect(detectDelimiter(text)).toBe(delimiter);
  });

  test("guessDelimiter looks at the first 50 non-blank lines only", () => {
    const lines = [...Array.from({ length: 50 }, () => "a,b"), ...Array.from({ length: 60 }, () => "1;2")];
    expect(guessDelimiter(lines)).toBe(",");
    expect(guessDelimiter(["", "  ", "1;2", "a,b"])).toBe(";");
    expect(guessDelimiter(["1;2", "a,b", "c,d"])).toBe(",");
  });

  test("splitLine groups quoted separators, unescapes doubled quotes and trims (RFC 4180 quoting)", () => {
    expect(splitLine('a,"b,c" ,"say ""hi"""', ",")).toEqual(["a", "b,c", 'say "hi"']);
    expect(splitLine("1;2 ; 3", ";")).toEqual(["1", "2", "3"]);
    expect(splitLine("1,5\t2", "\t")).toEqual(["1,5", "2"]);
    expect(splitLine("   ", ",")).toEqual([]);
    // A quote opens a quoted cell only at the cell's start, as in every uploaded file.
    expect(splitLine('a, "b,c"', ",")).toEqual(["a", '"b', 'c"']);
  });

  test("readTable trims cells and turns blank rows into empty arrays, keeping their place", () => {
    const read = readTable(" a , b \n\n ,  \n1,2");
    expect(read.ok && read.table.rows).toEqual([["a", "b"], [], [], ["1", "2"]]);
  });
});

describe("header cells", () => {
  test.each([
    ["V_DS [V]", "V_DS", "V"],
    ["Vds (V)", "Vds", "V"],
    ["I_D / mA", "I_D", "mA"],
    ["Id in A", "Id", "A"],
    ["pulse width", "pulse width", null],
    ["t_p [ ms ]", "t_p", "ms"],
  ])("splits %s", (cell, name, unit) => {
    expect(splitHeader(cell)).toEqual({ name, unit });
  });

  test("names X and Y only count as axes of a digitiser's pair", () => {
    expect(quantityOfName("X")).toBeNull();
    expect(quantityOfName("X", true)).toBe("voltage");
    expect(quantityOfName("I_D")).toBe("current");
  });

  test.each([
    ["mA", "current", 1e-3],
    ["ma", "current", 1e-3],
    ["kV", "voltage", 1e3],
    ["V", "voltage", 1],
    ["MS", "width", 1e-3],
    ["usec", "width", 1e-6],
    ["µs", "width", 1e-6],
  ] as const)("reads the unit %s", (unit, quantity, scale) => {
    expect(unitScale(unit)).toEqual({ ok: true, quantity, scale });
  });

  test("refuses units that are not s, V or A", () => {
    expect(unitScale("W")).toEqual({
      ok: false,
      reason: "unit 'W' is not understood (expected s, V or A, with a prefix if needed)",
    });
    expect(unitScale("m", "current")).toEqual({
      ok: false,
      reason: "unit 'm' is not understood (expected A, with a prefix if needed)",
    });
  });
});

describe("cells", () => {
  test("a decimal comma is a point only where the separator is ';' or tab", () => {
    expect(decimalPoint("1,5", ";")).toBe("1.5");
    expect(decimalPoint("1,5e-3", "\t")).toBe("1.5e-3");
    expect(decimalPoint("1,5", ",")).toBeNull();
    expect(decimalPoint("1.234,5", ";")).toBeNull();
    expect(decimalPoint("1,234,5", ";")).toBeNull();
  });

  test("numbers: bare ones scaled, prefixed ones read as written", () => {
    expect(readNumber("250", "current", 1e-3, ",")).toEqual({ ok: true, value: 0.25 });
    expect(readNumber("250 mA", "current", 1e-3, ",")).toEqual({ ok: true, value: 0.25 });
    expect(readNumber("2,5", "voltage", 1, ";")).toEqual({ ok: true, value: 2.5 });
  });

  test("widths: labels allow words around the width but not a bare number", () => {
    expect(readWidth("single pulse 10 µs", 1, ",", true)).toEqual({ ok: true, value: 1e-5 });
    expect(readWidth("single pulse 10 µs", 1, ",")).toMatchObject({ ok: false });
    expect(readWidth("DC operation", 1, ",", true)).toEqual({ ok: true, value: "DC" });
    expect(readWidth("10", 1e-3, ",")).toEqual({ ok: true, value: 0.01 });
    expect(readWidth("1,5 ms", 1, ";")).toEqual({ ok: true, value: 1.5e-3 });
  });
});

describe("issues", () => {
  test.each([
    [0, "A"],
    [25, "Z"],
    [26, "AA"],
    [51, "AZ"],
    [52, "BA"],
    [701, "ZZ"],
    [702, "AAA"],
  ])("column %i is %s, as spreadsheets letter them", (index, letter) => {
    // Reference: the bijective base-26 column names of spreadsheets (common practice, no source).
    expect(columnLetter(index)).toBe(letter);
  });

  test("messages name what is known of the place", () => {
    expect(csvIssue(3, "I_D [A]", "bad").message).toBe("row 3, column I_D [A]: bad");
    expect(csvIssue(3, null, "bad").message).toBe("row 3: bad");
    expect(csvIssue(null, null, "bad").message).toBe("bad");
  });

  test("an issue list keeps the first ones by row and counts the rest", () => {
    const list = createIssueList(2);
    list.add(5, null, "e");
    list.add(2, null, "b");
    list.add(1, null, "a");
    expect(list.count).toBe(3);
    expect(list.list().map((i) => i.message)).toEqual(["row 2: b", "row 5: e", "1 more problem not listed"]);
  });
});
