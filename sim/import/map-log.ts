/**
 * A read table through its mapping into a MappedLog: every cell of the mapped columns is checked,
 * and the first bad one is refused with its file line, column and text, e.g.
 * `line 14, column "PV [°C]": "12,4x" is not a number`.
 * Time becomes seconds from the first row; °F becomes °C by t/°C = (t/°F − 32)·5/9, the exact
 * relation of the two scales (NIST SP 811, 2008 edition, Appendix B; ITS-90 temperatures; section
 * from memory).
 */
import type { ImportRefusal, LogMapping, MappedLog } from "./log-mapping";
import { parseNumber } from "./parse-number";
import { parseTimestamp } from "./parse-timestamp";
import type { LogTable } from "./read-log-table";

/** OUT outside this band is not a percentage (a little over/under range is allowed for offsets), % */
export const OUT_MIN_PERCENT = -5;
export const OUT_MAX_PERCENT = 105;

export function fahrenheitToCelsius(f: number): number {
  // divided first so that huge inputs cannot overflow
  return ((f - 32) / 9) * 5;
}

function refuse(code: ImportRefusal["code"], message: string): ImportRefusal {
  return { ok: false, code, message };
}

/** "PV [°C]" in quotes when the file has a header, else "3" (1-based) */
export function columnLabel(table: LogTable, index: number): string {
  const h = table.headers?.[index];
  return h ? `"${h}"` : String(index + 1);
}

function quoteCell(c: string): string {
  const s = c.length > 40 ? c.slice(0, 40) + "…" : c;
  return c === "" ? "an empty cell" : `"${s}"`;
}

function normaliseMode(c: string): string {
  const s = c.trim().toLowerCase();
  if (["auto", "automatic", "a", "aut"].includes(s)) return "auto";
  if (["manual", "man", "m", "hand"].includes(s)) return "manual";
  return c.trim();
}

export function mapLog(table: LogTable, mapping: LogMapping): { ok: true; log: MappedLog } | ImportRefusal {
  const c = mapping.columns;
  const named: [string, number | null][] = [["time", c.time], ["OUT", c.out], ["PV", c.pv], ["SP", c.sp], ["mode", c.mode]];
  for (const [role, i] of named)
    if (i !== null && i >= table.columnCount)
      return refuse("bad-mapping", `the ${role} column is set to column ${i + 1}, but the file has only ${table.columnCount} column(s)`);
  const used = named.filter(([, i]) => i !== null) as [string, number][];
  for (let a = 0; a < used.length; a++)
    for (let b = a + 1; b < used.length; b++)
      if (used[a][1] === used[b][1]) return refuse("bad-mapping", `the ${used[a][0]} and ${used[b][0]} columns are both set to column ${columnLabel(table, used[a][1])}: each needs its own`);

  const n = table.rows.length;
  const t: number[] = new Array(n);
  const out: number[] = new Array(n);
  const pv: number[] = new Array(n);
  const sp: number[] | null = c.sp !== null ? new Array(n) : null;
  const mode: string[] | null = c.mode !== null ? new Array(n) : null;
  const toC = mapping.temperatureUnit === "F" ? fahrenheitToCelsius : (x: number) => x;
  let t0 = 0;
  let startedAt: string | null = null;

  for (let r = 0; r < n; r++) {
    const row = table.rows[r];
    const line = table.lineNumbers[r];
    const at = (i: number) => `line ${line}, column ${columnLabel(table, i)}`;
    const num = (i: number): number | ImportRefusal => {
      const cell = row[i] ?? "";
      const v = parseNumber(cell, mapping.decimalMark);
      if (v !== null) return v;
      const other = mapping.decimalMark === "." ? "," : ".";
      const hint = parseNumber(cell, other) !== null ? ` (it is written with a decimal "${other}": set the decimal mark to "${other}")` : "";
      return refuse("non-numeric", `${at(i)}: ${quoteCell(cell)} is not a number${hint}`);
    };

    let time: number;
    if (mapping.timeFormat === "timestamp") {
      const cell = row[c.time] ?? "";
      const ts = parseTimestamp(cell);
      if (!ts)
        return refuse(
          "bad-timestamp",
          `${at(c.time)}: ${quoteCell(cell)} is not a date-time (expected e.g. "2026-03-04T10:15:30" or "04.03.2026 10:15:30"${parseNumber(cell, mapping.decimalMark) !== null ? '; for elapsed seconds set the time format to "seconds"' : ""})`,
        );
      if (r === 0) {
        t0 = ts.epochS;
        startedAt = ts.iso;
      }
      time = ts.epochS - t0;
    } else {
      const v = num(c.time);
      if (typeof v !== "number") {
        if (parseTimestamp(row[c.time] ?? "")) return refuse("non-numeric", `${v.message}; it looks like a date-time: set the time format to "timestamp"`);
        return v;
      }
      if (r === 0) t0 = v;
      time = v - t0;
    }
    if (!Number.isFinite(time)) return refuse("non-numeric", `${at(c.time)}: ${quoteCell(row[c.time] ?? "")} is too far from the first row's time to be a time`);
    if (r > 0 && !(time > t[r - 1]))
      return refuse(
        "time-not-increasing",
        `line ${line}: time does not increase (${quoteCell(row[c.time] ?? "")} after ${quoteCell(table.rows[r - 1][c.time] ?? "")} on line ${table.lineNumbers[r - 1]}); sort the rows and remove duplicates${mapping.timeFormat === "timestamp" ? " (a daylight-saving change inside the log also does this)" : ""}`,
      );
    t[r] = time;

    const u = num(c.out);
    if (typeof u !== "number") return u;
    if (u < OUT_MIN_PERCENT || u > OUT_MAX_PERCENT)
      return refuse(
        "bad-mapping",
        `${at(c.out)}: OUT ${quoteCell(row[c.out])} is outside ${OUT_MIN_PERCENT}…${OUT_MAX_PERCENT}: OUT must be in % (0–100); check that the OUT column is the controller output, not a raw count or mA`,
      );
    out[r] = u;

    const y = num(c.pv);
    if (typeof y !== "number") return y;
    pv[r] = toC(y);

    if (sp && c.sp !== null) {
      const s = num(c.sp);
      if (typeof s !== "number") return s;
      sp[r] = toC(s);
    }
    if (mode && c.mode !== null) mode[r] = normaliseMode(row[c.mode] ?? "");
  }
  return { ok: true, log: { t, out, pv, sp, mode, startedAt } };
}
