/**
 * A first guess of a log's mapping, offered to the technician to confirm or correct:
 * - columns by header name (case, spaces, punctuation and units in brackets ignored);
 *   without a header, or when the "header" starts with three numbers, the first three columns are time, OUT, PV;
 * - temperature unit "F" when the PV (or SP) header says °F / degF / [F];
 * - decimal mark "," when the delimiter is ';' or tab and number cells are written "12,5";
 * - time format "timestamp" when the time cells read as date-times.
 */
import { logMappingSchema, type LogMapping } from "./log-mapping";
import { isNumberCell } from "./parse-number";
import { parseTimestamp } from "./parse-timestamp";
import { readLogTable, type LogTable } from "./read-log-table";
import type { ImportRefusal } from "./log-mapping";

export interface GuessOptions {
  /** rows inspected for the decimal mark and time format (default 50) */
  sampleRows?: number;
}

type Role = "time" | "out" | "pv" | "sp" | "mode";

// normalised names (see normaliseHeader); the first match in ROLE_ORDER wins
const NAMES: Record<Role, string[]> = {
  time: ["time", "t", "timestamp", "date", "datetime", "dateandtime", "datum", "zeit", "elapsed", "elapsedtime", "times", "timesec", "seconds", "secs", "sec", "s"],
  out: ["out", "output", "outpercent", "outpct", "op", "mv", "co", "power", "heater", "heateroutput", "manipulated"],
  pv: ["pv", "pvc", "pvf", "temperature", "temp", "tempc", "tempf", "processvalue", "pvraw", "pvfiltered", "measured", "y"],
  sp: ["sp", "setpoint", "spc", "spf", "target"],
  mode: ["mode", "automan", "am", "manauto", "controlmode", "automanual"],
};
const ROLE_ORDER: Role[] = ["time", "mode", "sp", "out", "pv"];

/** Lower case, without units in brackets, degree signs, %, spaces and punctuation. */
export function normaliseHeader(h: string): string {
  return h
    .toLowerCase()
    .replace(/\[.*?\]|\(.*?\)|\{.*?\}/g, "")
    .replace(/°[cf]\b|\bdeg[cf]\b/g, "")
    .replace(/[^a-z0-9]/g, "");
}

/** Whether a header cell says degrees Fahrenheit ("PV [°F]", "temp (degF)", "PV °F", "PV [F]"). */
export function saysFahrenheit(h: string): boolean {
  return /°\s*f\b|\bdeg\s*f\b|\[\s*f\s*\]|\(\s*f\s*\)|fahrenheit/i.test(h);
}

function findColumns(headers: string[]): Record<Role, number | null> {
  const norm = headers.map(normaliseHeader);
  const taken = new Set<number>();
  const found: Record<Role, number | null> = { time: null, out: null, pv: null, sp: null, mode: null };
  for (const role of ROLE_ORDER) {
    // exact names first, then headers that start with one of the longer names ("temperature1")
    let idx = -1;
    for (const name of NAMES[role]) {
      idx = norm.findIndex((n, i) => !taken.has(i) && n === name);
      if (idx >= 0) break;
    }
    if (idx < 0)
      for (const name of NAMES[role].filter((n) => n.length >= 4)) {
        idx = norm.findIndex((n, i) => !taken.has(i) && n.startsWith(name));
        if (idx >= 0) break;
      }
    if (idx >= 0) {
      found[role] = idx;
      taken.add(idx);
    }
  }
  return found;
}

function firstFree(count: number, taken: (number | null)[]): number {
  for (let i = 0; i < Math.max(count, 3); i++) if (!taken.includes(i)) return i;
  return 0;
}

export function guessMapping(table: LogTable, opts: GuessOptions = {}): LogMapping {
  const sample = table.rows.slice(0, opts.sampleRows ?? 50);
  const headers = table.headers;
  // a "header" whose first three cells are numbers or date-times is a first data row
  const isData = (h: string) => isNumberCell(h, ".") || isNumberCell(h, ",") || parseTimestamp(h) !== null;
  const headerRow = headers !== null && !headers.slice(0, 3).every(isData);
  let cols: Record<Role, number | null>;
  if (headerRow && headers) {
    cols = findColumns(headers);
    // roles not found by name take the leftmost free columns in the order time, OUT, PV
    for (const role of ["time", "out", "pv"] as const) if (cols[role] === null) cols[role] = firstFree(table.columnCount, Object.values(cols));
  } else {
    cols = { time: 0, out: 1, pv: 2, sp: null, mode: null };
  }
  const fahrenheit = headerRow && headers ? [cols.pv, cols.sp].some((i) => i !== null && headers[i] !== undefined && saysFahrenheit(headers[i])) : false;

  // decimal comma only where it cannot be a delimiter; decided on the OUT and PV cells
  let decimalMark: "." | "," = ".";
  if (table.delimiter !== ",") {
    let dot = 0;
    let comma = 0;
    for (const r of sample)
      for (const i of [cols.out, cols.pv]) {
        const c = i !== null ? r[i] ?? "" : "";
        if (/\d,\d/.test(c) && isNumberCell(c, ",")) comma++;
        else if (/\d\.\d/.test(c) && isNumberCell(c, ".")) dot++;
      }
    if (comma > dot) decimalMark = ",";
  }
  let stamps = 0;
  for (const r of sample) if (cols.time !== null && parseTimestamp(r[cols.time] ?? "") !== null) stamps++;
  const timeFormat = sample.length > 0 && stamps >= 0.5 * sample.length ? "timestamp" : "seconds";

  return logMappingSchema.parse({
    delimiter: table.delimiter,
    decimalMark,
    headerRow,
    columns: { time: cols.time ?? 0, out: cols.out ?? 1, pv: cols.pv ?? 2, sp: cols.sp, mode: cols.mode },
    timeFormat,
    temperatureUnit: fahrenheit ? "F" : "C",
  });
}

/** Read the text with the delimiter found automatically and a header assumed, then guess (the upload page's first step). */
export function guessMappingForText(text: string, opts: GuessOptions = {}): { ok: true; mapping: LogMapping; table: LogTable } | ImportRefusal {
  try {
    const read = readLogTable(text, { delimiter: "auto", headerRow: true });
    if (!read.ok) {
      // a single data row read as a header leaves no rows: read again without one
      const bare = readLogTable(text, { delimiter: "auto", headerRow: false });
      if (!bare.ok) return read;
      const mapping = guessMapping(bare.table, opts);
      return { ok: true, mapping, table: bare.table };
    }
    const mapping = guessMapping(read.table, opts);
    if (mapping.headerRow) return { ok: true, mapping, table: read.table };
    const bare = readLogTable(text, { delimiter: read.table.delimiter, headerRow: false });
    return bare.ok ? { ok: true, mapping, table: bare.table } : bare;
  } catch (e) {
    return { ok: false, code: "unreadable", message: `the file could not be read: ${e instanceof Error ? e.message : String(e)}` };
  }
}
