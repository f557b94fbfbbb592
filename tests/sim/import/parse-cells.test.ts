import { describe, expect, it } from "vitest";
import { parseNumber, parseTimestamp, fahrenheitToCelsius } from "@/sim/import";

describe("parseNumber", () => {
  it("reads plain decimals with the chosen mark (common practice: '.' or ',' as the decimal sign, ISO 80000-1 allows both)", () => {
    expect(parseNumber("12.5", ".")).toBe(12.5);
    expect(parseNumber(" -0.25 ", ".")).toBe(-0.25);
    expect(parseNumber("12,5", ",")).toBe(12.5);
    expect(parseNumber("−3,5", ",")).toBe(-3.5); // Unicode minus from spreadsheets
    expect(parseNumber("1.5e-3", ".")).toBe(0.0015);
    expect(parseNumber(".5", ".")).toBe(0.5);
  });
  it("refuses what is not plainly one number (our rule: strict, no thousands separators)", () => {
    for (const c of ["12.5.3", "abc", "", "  ", "12,4x", "1e400", "NaN", "Infinity", "0x10", "1 000", "+-1"]) expect(parseNumber(c, ".")).toBeNull();
    expect(parseNumber("12,5", ".")).toBeNull();
    expect(parseNumber("12.5", ",")).toBeNull();
    expect(parseNumber("1.234,5", ",")).toBeNull();
    expect(parseNumber("1,234.5", ".")).toBeNull();
  });
});

describe("parseTimestamp", () => {
  // 2000-01-01T00:00:00Z is Unix time 946 684 800 s (POSIX time, a common reference value, from memory)
  it("reads ISO 8601 extended format with T or space, fractions and zones (ISO 8601-1, from memory)", () => {
    expect(parseTimestamp("2000-01-01T00:00:00Z")?.epochS).toBe(946684800);
    expect(parseTimestamp("2000-01-01 00:00:00")?.epochS).toBe(946684800);
    expect(parseTimestamp("2000-01-01T01:00:00+01:00")?.epochS).toBe(946684800);
    expect(parseTimestamp("2000-01-01T00:00:00-0130")?.epochS).toBe(946684800 + 5400);
    expect(parseTimestamp("2026-03-04T10:15:30.5")!.epochS - parseTimestamp("2026-03-04T10:15:30")!.epochS).toBeCloseTo(0.5, 9);
    expect(parseTimestamp("2026-03-04T10:15:30.5")?.iso).toBe("2026-03-04T10:15:30.5");
    expect(parseTimestamp("2026-03-04T10:15")?.iso).toBe("2026-03-04T10:15:00");
  });
  it("reads day.month.year (the European logger spelling) as the same instant", () => {
    expect(parseTimestamp("01.01.2000 00:00:00")?.epochS).toBe(946684800);
    expect(parseTimestamp("04.03.2026 10:15:30")?.epochS).toBe(parseTimestamp("2026-03-04T10:15:30")?.epochS);
    expect(parseTimestamp("4.3.2026 10:15:30,25")?.iso).toBe("2026-03-04T10:15:30.25");
  });
  it("refuses impossible dates (Gregorian leap-year rule, common knowledge)", () => {
    expect(parseTimestamp("2024-02-29T00:00:00")).not.toBeNull(); // 2024 is a leap year
    expect(parseTimestamp("2026-02-29T00:00:00")).toBeNull();
    expect(parseTimestamp("1900-02-29T00:00:00")).toBeNull(); // century, not divisible by 400
    expect(parseTimestamp("2000-02-29T00:00:00")).not.toBeNull();
    for (const c of ["2026-13-01T00:00:00", "2026-04-31 00:00:00", "2026-01-01T24:00:00", "32.01.2026 10:00:00", "10:15:30", "12.5", "", "2026/03/04 10:15:30"])
      expect(parseTimestamp(c)).toBeNull();
  });
});

describe("°F → °C", () => {
  // t/°C = (t/°F − 32)/1.8 (NIST SP 811, 2008, Appendix B, from memory): fixed points 32 °F = 0 °C, 212 °F = 100 °C, −40 °F = −40 °C
  it("matches the defining relation at its fixed points", () => {
    expect(fahrenheitToCelsius(32)).toBe(0);
    expect(fahrenheitToCelsius(212)).toBeCloseTo(100, 12);
    expect(fahrenheitToCelsius(-40)).toBeCloseTo(-40, 12);
    expect(fahrenheitToCelsius(350)).toBeCloseTo(176.6667, 4);
    expect(Number.isFinite(fahrenheitToCelsius(1.7e308))).toBe(true);
  });
});
