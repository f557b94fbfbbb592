import { describe, expect, it } from "vitest";
import { importLog, logMappingSchema, MAX_UPLOAD_BYTES, MIN_LOG_ROWS, type LogMappingInput } from "@/sim/import";

const mapping = (m: Partial<LogMappingInput> = {}) => logMappingSchema.parse({ columns: { time: 0, out: 1, pv: 2 }, ...m });

/** An invented first-order response: OUT 30 → 40 % at row 10, PV 20 → 26 °C. */
function log(n = 60, sep = ",", row: (i: number) => string[] | null = () => null): string {
  const lines = ["# invented test data", ["time [s]", "OUT [%]", "PV [°C]"].join(sep)];
  for (let i = 0; i < n; i++) {
    const pv = 20 + (i < 10 ? 0 : 6 * (1 - Math.exp(-(i - 10) / 12)));
    lines.push((row(i) ?? [String(i), i < 10 ? "30" : "40", pv.toFixed(2)]).join(sep));
  }
  return lines.join("\n") + "\n";
}
const size = (s: string) => new TextEncoder().encode(s).length;

function refusal(text: string, m = mapping(), bytes = size(text)) {
  const r = importLog(text, bytes, m);
  if (r.ok) throw new Error("expected a refusal");
  expect(r.message.length).toBeGreaterThan(10);
  return r;
}

describe("importLog accepts a clean log", () => {
  it("maps, shifts time to the first row and summarises", () => {
    const text = log(60, ",", (i) => [String(100 + 2 * i), i < 10 ? "30" : "40", (20 + (i < 10 ? 0 : 6 * (1 - Math.exp(-(i - 10) / 12)))).toFixed(2)]);
    const r = importLog(text, size(text), mapping());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.log.t[0]).toBe(0);
    expect(r.log.t[59]).toBe(118);
    expect(r.summary).toMatchObject({ rows: 60, spanS: 118, medianIntervalS: 2, irregular: false, gaps: [], startedAt: null });
    expect(r.summary.step).toEqual({ timeS: 20, outBeforePercent: 30, outAfterPercent: 40 });
    expect(r.summary.columns).toEqual({ time: "time [s]", out: "OUT [%]", pv: "PV [°C]", sp: null, mode: null });
    expect(r.summary.quantizationStepC).toBeCloseTo(0.01, 6); // printed to 2 decimals
  });
  it("reads SP and mode, normalising MAN/AUTO and keeping other words", () => {
    const text = log(30, "\t", (i) => [String(i), i < 10 ? "30" : "40", String(20 + (i < 12 ? 0 : 0.2 * (i - 11))), "55", i < 28 ? "MAN" : i < 29 ? "Auto" : "tune"]);
    const r = importLog(text, size(text), mapping({ columns: { time: 0, out: 1, pv: 2, sp: 3, mode: 4 } }));
    expect(r.ok && r.log.mode?.slice(26)).toEqual(["manual", "manual", "auto", "tune"]);
    expect(r.ok && r.log.sp?.[0]).toBe(55);
  });
});

describe("importLog refusals: each code, with its message", () => {
  it("empty: zero bytes or blank text", () => {
    expect(refusal("", mapping(), 0).code).toBe("empty");
    expect(refusal("  \n\n", mapping(), 4).code).toBe("empty");
    expect(refusal("# just a comment\n").code).toBe("empty");
  });
  it("too-large: states the size and the 2 MiB limit", () => {
    const r = refusal(log(), mapping(), Math.round(3.1 * 1024 * 1024));
    expect(r.code).toBe("too-large");
    expect(r.message).toMatch(/the file is 3\.1 MiB; the limit is 2 MiB/);
    expect(importLog(log(), MAX_UPLOAD_BYTES, mapping()).ok).toBe(true); // the limit itself is accepted
  });
  it("unreadable: an unclosed quote, naming the line", () => {
    const r = refusal(log(60, ",", (i) => (i === 5 ? ["5", "30", '"20.00'] : null)));
    expect(r.code).toBe("unreadable");
    expect(r.message).toMatch(/^line 8:/);
  });
  it("bad-mapping: a column past the last one, two roles on one column, OUT not in %", () => {
    const past = refusal(log(), mapping({ columns: { time: 0, out: 1, pv: 5 } }));
    expect(past.code).toBe("bad-mapping");
    expect(past.message).toMatch(/PV column is set to column 6, but the file has only 3/);
    const twice = refusal(log(), mapping({ columns: { time: 0, out: 1, pv: 1 } }));
    expect(twice.message).toMatch(/OUT and PV columns are both set to column "OUT \[%\]"/);
    const raw = refusal(log(60, ",", (i) => [String(i), i < 10 ? "1200" : "1600", "20"]));
    expect(raw.code).toBe("bad-mapping");
    expect(raw.message).toMatch(/^line 3, column "OUT \[%\]": OUT "1200" is outside -5…105: OUT must be in % \(0–100\)/);
  });
  it("non-numeric: names line, column header and cell; hints at the decimal mark", () => {
    const r = refusal(log(60, ";", (i) => (i === 11 ? ["11", "40", "12,4x"] : null)));
    expect(r.code).toBe("non-numeric");
    expect(r.message).toBe('line 14, column "PV [°C]": "12,4x" is not a number');
    const comma = refusal(log(60, ";", (i) => (i === 0 ? ["0", "30", "20,5"] : null)));
    expect(comma.message).toMatch(/line 3, column "PV \[°C\]": "20,5" is not a number \(it is written with a decimal ","/);
    const empty = refusal(log(60, ",", (i) => (i === 2 ? ["2", "30"] : null)));
    expect(empty.message).toBe('line 5, column "PV [°C]": an empty cell is not a number');
    const noHeader = refusal("0,30,x\n", mapping({ headerRow: false }));
    expect(noHeader.message).toBe('line 1, column 3: "x" is not a number');
    const stamp = refusal(log(60, ",", (i) => [`2026-03-04T10:00:${String(i % 60).padStart(2, "0")}`, "30", "20"]));
    expect(stamp.message).toMatch(/looks like a date-time: set the time format to "timestamp"/);
  });
  it("bad-timestamp: names line, column and cell", () => {
    const text = log(60, ";", (i) => [i === 7 ? "31.02.2026 10:00:07" : `04.03.2026 10:00:${String(i).padStart(2, "0")}`, "30", "20"]);
    const r = refusal(text, mapping({ timeFormat: "timestamp" }));
    expect(r.code).toBe("bad-timestamp");
    expect(r.message).toMatch(/^line 10, column "time \[s\]": "31\.02\.2026 10:00:07" is not a date-time/);
  });
  it("time-not-increasing: names the line and the previous one", () => {
    const r = refusal(log(60, ",", (i) => (i === 20 ? ["18.5", "40", "24"] : null)));
    expect(r.code).toBe("time-not-increasing");
    expect(r.message).toMatch(/^line 23: time does not increase \("18\.5" after "19" on line 22\)/);
    const dup = refusal(log(60, ",", (i) => (i === 21 ? ["20", "40", "24"] : null)));
    expect(dup.message).toMatch(/^line 24:/);
  });
  it(`too-few-points: fewer than ${MIN_LOG_ROWS} rows`, () => {
    const r = refusal(log(MIN_LOG_ROWS - 1));
    expect(r.code).toBe("too-few-points");
    expect(r.message).toMatch(/19 data row\(s\); at least 20/);
    expect(importLog(log(MIN_LOG_ROWS), 1000, mapping()).ok).toBe(true);
  });
  it("no-step: states the OUT range found", () => {
    const r = refusal(log(60, ",", (i) => [String(i), i % 2 ? "35.2" : "35", String(20 + i / 10)]));
    expect(r.code).toBe("no-step");
    expect(r.message).toMatch(/OUT: it stays between 35 and 35\.2 %/);
  });
  it("pv-flat: PV exactly constant, or moving by one resolution step only", () => {
    const flat = refusal(log(60, ",", (i) => [String(i), i < 10 ? "30" : "40", "21.5"]));
    expect(flat.code).toBe("pv-flat");
    expect(flat.message).toMatch(/stays between 21\.5 and 21\.5 °C/);
    const toggling = refusal(log(60, ",", (i) => [String(i), i < 10 ? "30" : "40", i % 3 ? "21.5" : "21.6"]));
    expect(toggling.code).toBe("pv-flat");
    expect(toggling.message).toMatch(/one resolution step is 0\.1 °C/);
  });
  it("never throws on hostile arguments (last line of defence: unreadable)", () => {
    const r = importLog(null as unknown as string, 10, mapping());
    expect(r.ok).toBe(false);
    const bad = importLog(log(), 100, { ...mapping(), columns: null } as never);
    expect(!bad.ok && bad.code).toBe("unreadable");
  });
});
