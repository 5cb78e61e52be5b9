import { describe, expect, it } from "vitest";
import {
  count,
  dateText,
  editable,
  factor,
  fileSize,
  inUnit,
  kelvin,
  money,
  percent,
  plainSpaces,
  plural,
  progress,
  q,
  repeatOf,
  repeatText,
  settingPercent,
} from "./format";
import { BUILDER_NAMES, builderName, pulseShape, sourceWords, verdictWords } from "./vocabulary";

// Expected texts are written by hand from the rules in format.ts's header (DESIGN.md, numbers and units: three
// significant figures, a thin space U+2009 before the unit); "our choice" marks the product's own rules.
const T = "\u2009";

describe("q, a quantity with its unit", () => {
  it("writes three significant figures in engineering notation", () => {
    expect(q(0.0042, "Ω")).toBe(`4.2${T}mΩ`);
    expect(q(1.5e-4, "s")).toBe(`150${T}µs`);
    expect(q(1234, "W")).toBe(`1.23${T}kW`);
    expect(q(48, "V")).toBe(`48${T}V`);
  });
  it("gives a dash where there is no value, and 'off scale' beyond the sane temperature range", () => {
    expect(q(null, "V")).toBe("—");
    expect(q(undefined, "A")).toBe("—");
    expect(q(Number.NaN, "A")).toBe("—");
    expect(q(87, "°C")).toBe(`87${T}°C`);
    expect(q(1e6, "°C")).toMatch(/^off scale \(above /);
  });
});

describe("settingPercent, a limit as set (our choice: never rounded to another setting)", () => {
  it("writes the setting's own figures", () => {
    expect(settingPercent(0.875)).toBe(`87.5${T}%`);
    expect(settingPercent(0.9)).toBe(`90${T}%`);
    expect(settingPercent(0.8125)).toBe(`81.25${T}%`);
    expect(settingPercent(null)).toBe("—");
  });
});

// A displayed utilisation may read high, never low (METHODS.md's first principle, applied to what is shown).
describe("percent, utilisation (our choice: rounded up; whole percent from 10 %, two figures below)", () => {
  it("rounds up to a whole percentage from 10 %", () => {
    expect(percent(0.834)).toBe(`84${T}%`);
    expect(percent(1.32)).toBe(`132${T}%`);
    expect(percent(0.1)).toBe(`10${T}%`);
  });
  it("never shows a failing utilisation as 100 % or less", () => {
    expect(percent(1.004)).toBe(`101${T}%`);
    expect(percent(1.0000001)).toBe(`101${T}%`);
    expect(percent(1)).toBe(`100${T}%`);
  });
  it("does not round up the float noise of an exact value", () => {
    expect(1.1 * 100).not.toBe(110);
    expect(percent(1.1)).toBe(`110${T}%`);
    expect(0.07 * 100).not.toBe(7);
    expect(percent(0.07)).toBe(`7${T}%`);
    expect(percent(0.8)).toBe(`80${T}%`);
  });
  it("keeps two significant figures below 10 %, rounded up, without trailing zeros", () => {
    expect(percent(0.042)).toBe(`4.2${T}%`);
    expect(percent(0.05)).toBe(`5${T}%`);
    expect(percent(0.00123)).toBe(`0.13${T}%`);
    expect(percent(0)).toBe(`0${T}%`);
  });
  it("gives a dash for no value", () => {
    expect(percent(null)).toBe("—");
  });
});

describe("factor, a figure without unit (stability S, derating ×)", () => {
  it("keeps three significant figures without trailing zeros", () => {
    expect(factor(0.8)).toBe("0.8");
    expect(factor(0.85)).toBe("0.85");
    expect(factor(1.2345)).toBe("1.23");
    expect(factor(0.241432)).toBe("0.241");
    expect(factor(1)).toBe("1");
    expect(factor(null)).toBe("—");
  });
});

describe("money, fileSize, inUnit, editable", () => {
  it("writes a cost with two decimals and its currency", () => {
    expect(money(2.85, "EUR")).toBe(`2.85${T}EUR`);
    expect(money(3, null)).toBe("3.00");
    expect(money(null, "EUR")).toBe("—");
  });
  it("writes sizes in SI units with three significant figures", () => {
    expect(fileSize(512)).toBe(`512${T}B`);
    expect(fileSize(1250)).toBe(`1.25${T}kB`);
    expect(fileSize(5_000_000)).toBe(`5${T}MB`);
    expect(fileSize(5_242_880)).toBe(`5.24${T}MB`);
    expect(fileSize(200_000_000)).toBe(`200${T}MB`);
  });
  it("writes a rating in its column's unit", () => {
    expect(inUnit(0.0016, 1e-3)).toBe("1.6");
    expect(inUnit(null)).toBe("—");
  });
  it("writes a value for editing with its prefix and no unit, losing nothing", () => {
    expect(editable(1.5e-4)).toBe("150µ");
    expect(editable(0.0042)).toBe("4.2m");
    expect(editable(48)).toBe("48");
    expect(editable(0.1 + 0.2, "plain")).toBe("0.3");
    expect(editable(1 / 3)).toBe("333.333333333333m");
    expect(editable(null)).toBe("");
  });
  it("rounds a figure offered to another form as asked, and no further", () => {
    expect(editable(0.0123456789, "prefixed", 6)).toBe("12.3457m");
    expect(editable(87.5, "plain", 6)).toBe("87.5");
    expect(editable(0.07 * 100, "plain", 6)).toBe("7");
  });
});

describe("counts and repetitions", () => {
  it("writes counts and repetitions in words", () => {
    expect(plural(1, "pulse")).toBe("1 pulse");
    expect(plural(3, "pulse")).toBe("3 pulses");
    expect(repeatText({ period: 0.1, count: 10 })).toBe(`every 100${T}ms, 10 pulses`);
    expect(repeatText({ period: 1 })).toBe(`every 1${T}s, continuous`);
    expect(repeatText(undefined)).toBeNull();
    expect(repeatOf({ repeatPeriod: 0.1, repeatCount: null })).toEqual({ period: 0.1 });
    expect(repeatOf({ repeatPeriod: null, repeatCount: 3 })).toBeUndefined();
  });
  it("groups the thousands of a count, and writes a temperature difference in kelvin", () => {
    expect(count(1_000_000)).toBe("1,000,000");
    expect(count(999)).toBe("999");
    expect(progress(0.456)).toBe(`46${T}%`);
    expect(dateText(new Date("2026-12-03T06:14:59Z"))).toBe("2026-12-03");
    expect(dateText(new Date("2026-12-03T06:14:59Z"), true)).toBe("2026-12-03 06:14 UTC");
    expect(kelvin(25)).toBe(`25${T}K`);
    expect(kelvin(12.345)).toBe(`12.3${T}K`);
    expect(kelvin(null)).toBe("—");
  });
  it("sets plain spaces for the PDF's font", () => {
    expect(plainSpaces(`4.2${T}mΩ, 83${T}%`)).toBe("4.2 mΩ, 83 %");
  });
});

describe("the product's words (PRODUCT.md, Vocabulary)", () => {
  it("names verdicts and sources in the vocabulary's words", () => {
    expect(verdictWords["no-data"]).toBe("no data");
    expect(sourceWords.measured).toBe("measured pulse");
    expect(sourceWords["fault-case"]).toBe("fault case");
  });
  it("names a pulse's shape by where it came from", () => {
    expect(pulseShape({ kind: "waveform", source: "fault-case" })).toBe("fault sequence");
    expect(pulseShape({ kind: "waveform", source: "capture" })).toBe("recorded waveform");
    expect(pulseShape({ kind: "rect", source: "measured" })).toBe("rectangle");
  });
  it("names a stored origin's builder as its tab does, in running text", () => {
    expect(BUILDER_NAMES.clamp).toBe("Turn-off");
    expect(builderName("clamp")).toBe("turn-off");
    expect(builderName("unclamped")).toBe("unclamped turn-off");
    expect(builderName("current-limit")).toBe("short in current limit");
    expect(builderName("something-old")).toBe("something-old");
  });
});
