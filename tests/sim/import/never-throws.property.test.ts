import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { importLog, logMappingSchema, MAX_UPLOAD_BYTES, type ImportRefusalCode, type LogMapping } from "@/sim/import";

// Property (our contract, sim/import/import-log.ts): importLog never throws, and its answer is either
// a clean log or a refusal with a known code and a message.
const CODES: ImportRefusalCode[] = ["empty", "too-large", "unreadable", "bad-mapping", "non-numeric", "bad-timestamp", "time-not-increasing", "too-few-points", "no-step", "pv-flat"];

function check(text: string, bytes: number, mapping: LogMapping): void {
  let r: ReturnType<typeof importLog> | undefined;
  expect(() => (r = importLog(text, bytes, mapping))).not.toThrow();
  if (!r) return;
  if (!r.ok) {
    expect(CODES).toContain(r.code);
    expect(typeof r.message).toBe("string");
    expect(r.message.trim().length).toBeGreaterThan(0);
    // the catch-all is a last line of defence only: no input should reach it
    expect(r.message).not.toMatch(/^the file could not be read/);
    return;
  }
  const { log, summary } = r;
  const n = log.t.length;
  expect(n).toBeGreaterThanOrEqual(20);
  for (const a of [log.out, log.pv, ...(log.sp ? [log.sp] : [])]) expect(a.length).toBe(n);
  if (log.mode) expect(log.mode.length).toBe(n);
  expect(log.t[0]).toBe(0);
  for (let i = 0; i < n; i++) {
    for (const a of [log.t, log.out, log.pv, ...(log.sp ? [log.sp] : [])]) expect(Number.isFinite(a[i])).toBe(true);
    if (i > 0) expect(log.t[i]).toBeGreaterThan(log.t[i - 1]);
  }
  for (const v of [summary.spanS, summary.medianIntervalS, summary.noiseSigmaC, ...summary.pvRangeC]) expect(Number.isFinite(v)).toBe(true);
}

const mappingArb = fc
  .record({
    delimiter: fc.constantFrom("auto", ",", ";", "\t"),
    decimalMark: fc.constantFrom(".", ","),
    headerRow: fc.boolean(),
    columns: fc.record({
      time: fc.integer({ min: 0, max: 4 }),
      out: fc.integer({ min: 0, max: 4 }),
      pv: fc.integer({ min: 0, max: 4 }),
      sp: fc.option(fc.integer({ min: 0, max: 5 }), { nil: null }),
      mode: fc.option(fc.integer({ min: 0, max: 5 }), { nil: null }),
    }),
    timeFormat: fc.constantFrom("seconds", "timestamp"),
    temperatureUnit: fc.constantFrom("C", "F"),
  })
  .map((m) => logMappingSchema.parse(m));

const bytesArb = fc.oneof(fc.integer({ min: -5, max: 4000 }), fc.integer({ min: MAX_UPLOAD_BYTES - 2, max: MAX_UPLOAD_BYTES + 2 }), fc.constantFrom(NaN, Infinity, 0));

const badCell = fc.constantFrom("", "abc", "NaN", "Infinity", "1e400", "-1e400", "12.5.3", "12,4x", '"', '"12', "#", "9".repeat(400), "1,5", "−3", "  ", "2026-02-30T10:00:00", "04.03.2026 10:15:30", "1e308", "-1e308", "\u0000");
const goodCell = fc.oneof(
  fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((x) => String(x)),
  fc.integer({ min: -10, max: 110 }).map(String),
  fc.double({ min: 0, max: 100, noNaN: true }).map((x) => x.toFixed(2).replace(".", ",")),
);
const cell = fc.oneof({ arbitrary: goodCell, weight: 4 }, { arbitrary: badCell, weight: 1 });

const tableText = fc
  .record({
    sep: fc.constantFrom(",", ";", "\t", " "),
    header: fc.option(fc.array(fc.constantFrom("time", "OUT [%]", "PV [°F]", "sp", "mode", ""), { minLength: 1, maxLength: 5 })),
    rows: fc.array(fc.array(cell, { minLength: 0, maxLength: 6 }), { minLength: 0, maxLength: 40 }),
    eol: fc.constantFrom("\n", "\r\n", "\r"),
    cut: fc.option(fc.nat()),
    bom: fc.boolean(),
  })
  .map(({ sep, header, rows, eol, cut, bom }) => {
    const lines = [...(header ? [header.join(sep)] : []), ...rows.map((r) => r.join(sep))];
    const text = (bom ? "\ufeff" : "") + lines.join(eol);
    return cut === null ? text : text.slice(0, cut % (text.length + 1)); // a truncated upload
  });

/** A plausible bump log with a few cells spoiled at random, so the accepting path is exercised too. */
const nearlyGood = fc
  .record({
    n: fc.integer({ min: 15, max: 60 }),
    dt: fc.double({ min: 0.1, max: 10, noNaN: true }),
    comma: fc.boolean(),
    spoil: fc.array(fc.record({ row: fc.nat(), col: fc.integer({ min: 0, max: 2 }), cell: badCell }), { maxLength: 3 }),
    stepAt: fc.integer({ min: 0, max: 30 }),
  })
  .map(({ n, dt, comma, spoil, stepAt }) => {
    const sep = comma ? ";" : ",";
    const num = (x: number) => (comma ? String(x).replace(".", ",") : String(x));
    const rows = Array.from({ length: n }, (_, i) => [num(+(i * dt).toFixed(3)), num(i < stepAt ? 30 : 45), num(+(20 + (i < stepAt ? 0 : (i - stepAt) * 0.3)).toFixed(1))]);
    for (const s of spoil) rows[s.row % n][s.col] = s.cell;
    return { text: ["time;out;pv".replaceAll(";", sep), ...rows.map((r) => r.join(sep))].join("\n"), comma };
  });

describe("importLog on malformed input (fast-check)", () => {
  it("random strings never make it throw", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 200 }), fc.string({ unit: "binary", maxLength: 200 })), bytesArb, mappingArb, (text, bytes, m) => check(text, bytes, m)),
      { numRuns: 200 },
    );
  });
  it("random tables with bad cells, delimiters, decimal marks and truncation never make it throw", () => {
    fc.assert(fc.property(tableText, mappingArb, (text, m) => check(text, text.length + 1, m)), { numRuns: 200 });
  });
  it("nearly good logs are accepted clean or refused with a known code", () => {
    let accepted = 0;
    fc.assert(
      fc.property(nearlyGood, ({ text, comma }) => {
        const m = logMappingSchema.parse({ delimiter: "auto", decimalMark: comma ? "," : ".", columns: { time: 0, out: 1, pv: 2 } });
        check(text, text.length, m);
        if (importLog(text, text.length, m).ok) accepted++;
      }),
      { numRuns: 200 },
    );
    expect(accepted).toBeGreaterThan(20); // the generator does reach the accepting path
  });
});
