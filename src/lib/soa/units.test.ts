import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatQuantity, parseQuantity, type Unit } from "./units";

const THIN = "\u2009";

function value(text: string, unit?: Unit, allowDC = false): number | "DC" {
  const parsed = parseQuantity(text, unit, { allowDC });
  if (!parsed.ok) throw new Error(parsed.reason);
  return parsed.value;
}

function reason(text: string, unit?: Unit, allowDC = false): string {
  const parsed = parseQuantity(text, unit, { allowDC });
  if (parsed.ok) throw new Error(`parsed ${text} as ${parsed.value}`);
  return parsed.reason;
}

describe("parseQuantity", () => {
  // SI prefixes p n µ m k M G (common practice, no source).
  it.each([
    ["150us", "s", 150e-6],
    ["150 \u00b5s", "s", 150e-6],
    ["150 \u03bcs", "s", 150e-6],
    ["1.5e-4", "s", 1.5e-4],
    ["1.5E-4 s", "s", 1.5e-4],
    ["4.2m", "Ω", 4.2e-3],
    ["4.2 mΩ", "Ω", 4.2e-3],
    ["4.2 m\u2126", "Ω", 4.2e-3],
    ["4.2 mohm", "Ω", 4.2e-3],
    ["10ms", "s", 10e-3],
    ["2.5 mA", "A", 2.5e-3],
    ["3 MW", "W", 3e6],
    ["1.2 kW", "W", 1.2e3],
    ["1 GHz", "Hz", 1e9],
    ["5 pF", "F", 5e-12],
    ["1 µH", "H", 1e-6],
    ["1000 uF", "F", 1e-3],
    ["48", "V", 48],
    ["-40 °C", "°C", -40],
    ["0.5 K/W", "K/W", 0.5],
    [".5", undefined, 0.5],
    ["+7.", undefined, 7],
    ["  12 V  ", undefined, 12],
    [`150${THIN}µs`, undefined, 150e-6],
  ] as const)("reads %j as %s", (text, unit, expected) => {
    expect(value(text, unit)).toBe(expected);
  });

  // Our choice: "4.2m" with the unit implied (METHODS.md introduction: prefixes p n u µ m k M).
  it("reads a prefix alone as that power of ten, with the expected unit implied", () => {
    const parsed = parseQuantity("4.2m", "s");
    expect(parsed).toEqual({ ok: true, value: 4.2e-3, unit: "s" });
    expect(parseQuantity("3M")).toEqual({ ok: true, value: 3e6, unit: null });
  });

  // Common practice, no source: SI prefixes are case-sensitive (m = 10⁻³, M = 10⁶).
  it("keeps m (milli) and M (mega) apart", () => {
    expect(value("1 ms")).toBe(1e-3);
    expect(value("1 Ms")).toBe(1e6);
    expect(value("1m")).toBe(1e-3);
    expect(value("1M")).toBe(1e6);
  });

  // Our choice (issue 12): a single decimal comma is read as a decimal point.
  it("reads one decimal comma as a decimal point, as typed in many locales (issue 12)", () => {
    expect(value("1,5")).toBe(1.5);
    expect(value("4,2 mΩ", "Ω")).toBe(4.2e-3);
    expect(value("-0,25e-3 s", "s")).toBe(-0.25e-3);
    expect(value("250,5µs", "s")).toBe(250.5e-6);
  });

  // Derived from §1: "DC" is a curve duration, nowhere else a value.
  it('returns "DC" only when the option allows it', () => {
    expect(value("DC", "s", true)).toBe("DC");
    expect(value(" dc ", "s", true)).toBe("DC");
    expect(reason("DC", "s")).toBe("'DC' is not allowed here");
  });

  // Our choice: every refusal says why.
  it("rejects garbage with a clear reason", () => {
    expect(reason("")).toBe("expected a number");
    expect(reason("abc")).toBe("expected a number");
    expect(reason("NaN")).toBe("expected a number");
    expect(reason("1,500.5")).toBe("write one decimal separator and no thousands separator (e.g. 1500.5)");
    expect(reason("1,5,0 V")).toBe("write one decimal separator and no thousands separator (e.g. 1500.5)");
    expect(reason("5 x")).toBe("unknown unit 'x'");
    expect(reason("5 mx")).toBe("unknown unit 'mx'");
    expect(reason("1.5e")).toBe("unknown unit 'e'");
    expect(reason("10 V", "s")).toBe("expected unit 's', got 'V'");
    expect(reason("20 m°C")).toBe("°C takes no prefix");
    expect(reason("1e400")).toBe("number out of range");
  });
});

describe("formatQuantity", () => {
  // Presentation rules: DESIGN.md (thin space, three significant figures).
  it.each([
    [4.2e-3, "Ω", `4.2${THIN}mΩ`],
    [150e-6, "s", `150${THIN}µs`],
    [1200, "W", `1.2${THIN}kW`],
    [48, "V", `48${THIN}V`],
    [87, "°C", `87${THIN}°C`],
    [87.25, "°C", `87.3${THIN}°C`],
    [1234, "°C", `1234${THIN}°C`],
    [-40, "°C", `-40${THIN}°C`],
    [0.1234, "K/W", `0.123${THIN}K/W`],
    [1234.5, "W", `1.23${THIN}kW`],
    [999.96e-6, "s", `1${THIN}ms`],
    [1e-3, "s", `1${THIN}ms`],
    [1e-6, "s", `1${THIN}µs`],
    [1e9, "Hz", `1${THIN}GHz`],
    [-2.5e-3, "A", `-2.5${THIN}mA`],
    [0, "V", `0${THIN}V`],
    [1.5e-15, "s", `1.5e-15${THIN}s`],
    [2e12, "W", `2e12${THIN}W`],
    [1500, "", `1.5${THIN}k`],
    [15, "", "15"],
  ] as const)("writes %d %s as %j", (x, unit, expected) => {
    expect(formatQuantity(x, unit)).toBe(expected);
  });

  // Our choice: formatting to a given number of significant figures, "—" for no value.
  it("honours the number of significant figures and shows nothing for non-finite values", () => {
    expect(formatQuantity(Math.PI * 1e-3, "s", 5)).toBe(`3.1416${THIN}ms`);
    expect(formatQuantity(Math.PI, "V", 1)).toBe(`3${THIN}V`);
    expect(formatQuantity(Number.NaN, "V")).toBe("—");
    expect(formatQuantity(Number.POSITIVE_INFINITY, "A")).toBe("—");
  });

  // Our choice: formatting and parsing are inverse to the digits shown.
  it("parseQuantity(formatQuantity(x)) gives x back to three significant figures", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-12, max: 9.99e11, noNaN: true }),
        fc.constantFrom<Unit>("V", "A", "W", "s", "Ω"),
        (x, unit) => {
          const back = value(formatQuantity(x, unit), unit) as number;
          expect(Math.abs(back - x) / x).toBeLessThanOrEqual(5e-3);
        },
      ),
    );
  });
});
