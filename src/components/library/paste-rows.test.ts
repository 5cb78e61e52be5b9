import { describe, expect, test } from "vitest";
import { parsePastedRows } from "./paste-rows";

describe("parsePastedRows", () => {
  test("reads tab-separated rows from a spreadsheet and skips the header", () => {
    const text = "R_i [K/W]\ttau\r\n0.12\t250us\r\n0.3\t\t2.5m\r\n";
    expect(parsePastedRows(text)).toEqual([
      { r: "0.12", tau: "250us" },
      { r: "0.3", tau: "2.5m" },
    ]);
  });

  test("reads ';' with decimal commas, and ',' separated rows", () => {
    expect(parsePastedRows("0,12;250e-6\n0,3;2,5e-3")).toEqual([
      { r: "0,12", tau: "250e-6" },
      { r: "0,3", tau: "2,5e-3" },
    ]);
    expect(parsePastedRows('0.12, 250us\n"0.3","2.5 ms"')).toEqual([
      { r: "0.12", tau: "250us" },
      { r: "0.3", tau: "2.5 ms" },
    ]);
  });

  test("splits a line without a separator at its first run of spaces, keeping a unit with its value", () => {
    expect(parsePastedRows("0.12 250 us\n.3   2.5 ms\nonly")).toEqual([
      { r: "0.12", tau: "250 us" },
      { r: ".3", tau: "2.5 ms" },
    ]);
  });

  test("joins the cells after the first and skips rows whose first cell is not a number", () => {
    expect(parsePastedRows("1\t2\tms\nR\t3\n-0.5\t1")).toEqual([
      { r: "1", tau: "2 ms" },
      { r: "-0.5", tau: "1" },
    ]);
  });
});
