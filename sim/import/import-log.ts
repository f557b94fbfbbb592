/**
 * The one entry point for an uploaded bump-test log (the server action and the browser both call
 * it): size → read → map → enough rows → a step in OUT → a PV that moves, then a summary of what
 * was read. Never throws; every failure is an ImportRefusal with a message to act on.
 */
import { detectStep, MIN_STEP_PERCENT, median, noiseSigmaFromSecondDifferences, estimateQuantizationStep } from "../tuning/identify";
import { MAX_UPLOAD_BYTES, MIN_LOG_ROWS, type ImportRefusal, type LogMapping, type MappedLog } from "./log-mapping";
import { mapLog } from "./map-log";
import { readLogTable, type LogTable } from "./read-log-table";
import { mebibytesText } from "./byte-size";

/** Intervals differing from the median by more than this share make the sampling irregular (common practice). */
export const IRREGULAR_SHARE = 0.1;
/** An interval longer than this many medians is a gap, e.g. a logger dropout (common practice). */
export const GAP_FACTOR = 5;

export interface LogSummary {
  rows: number;
  /** time from the first to the last row, s */
  spanS: number;
  /** ISO 8601 time of the first row when time is absolute */
  startedAt: string | null;
  medianIntervalS: number;
  minIntervalS: number;
  maxIntervalS: number;
  /** some interval (gaps aside) differs from the median by more than 10 % */
  irregular: boolean;
  /** intervals over 5× the median: where they start (s from the first row) and how long they are */
  gaps: { atS: number; lengthS: number }[];
  /** PV noise σ from second differences, °C */
  noiseSigmaC: number;
  /** PV resolution when the PV is quantized (an ADC or display step), °C; null when continuous */
  quantizationStepC: number | null;
  step: { timeS: number; outBeforePercent: number; outAfterPercent: number };
  pvRangeC: [number, number];
  /** header names of the mapped columns ("column 3" without a header) */
  columns: { time: string; out: string; pv: string; sp: string | null; mode: string | null };
}

export type ImportResult = { ok: true; log: MappedLog; summary: LogSummary } | ImportRefusal;

function refuse(code: ImportRefusal["code"], message: string): ImportRefusal {
  return { ok: false, code, message };
}

function r3(x: number): string {
  return String(+x.toPrecision(3));
}

/** 2097152 → "2,097,152" (not toLocaleString: the text must not depend on the runtime's locale) */
function groupThousands(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
}

function headerName(table: LogTable, i: number | null): string | null {
  if (i === null) return null;
  return table.headers?.[i] || `column ${i + 1}`;
}

function range(xs: readonly number[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of xs) {
    lo = Math.min(lo, x);
    hi = Math.max(hi, x);
  }
  return [lo, hi];
}

function summarise(log: MappedLog, table: LogTable, mapping: LogMapping): LogSummary | ImportRefusal {
  const n = log.t.length;
  if (n < MIN_LOG_ROWS) return refuse("too-few-points", `the log has ${n} data row(s); at least ${MIN_LOG_ROWS} are needed (a good bump test has hundreds)`);
  const step = detectStep({ t: log.t, out: log.out, pv: log.pv });
  if (!step) {
    const [lo, hi] = range(log.out);
    return refuse("no-step", `no step in OUT: it stays between ${r3(lo)} and ${r3(hi)} % (a bump test needs a step of at least ${MIN_STEP_PERCENT} %, better 5–20 %); check that the OUT column is the controller output`);
  }
  const pvRange = range(log.pv);
  const q = estimateQuantizationStep(log.pv);
  const spread = pvRange[1] - pvRange[0];
  if (spread === 0 || (q !== null && spread <= q * (1 + 1e-9)))
    return refuse("pv-flat", `PV is flat: it stays between ${r3(pvRange[0])} and ${r3(pvRange[1])} °C${q !== null ? ` (one resolution step is ${r3(q)} °C)` : ""}; check the PV column and the sensor`);

  const intervals: number[] = [];
  for (let i = 1; i < n; i++) intervals.push(log.t[i] - log.t[i - 1]);
  const med = median(intervals);
  const [minI, maxI] = range(intervals);
  const gaps: { atS: number; lengthS: number }[] = [];
  let irregular = false;
  for (let i = 1; i < n; i++) {
    const dt = intervals[i - 1];
    if (dt > GAP_FACTOR * med) gaps.push({ atS: log.t[i - 1], lengthS: dt });
    else if (Math.abs(dt - med) > IRREGULAR_SHARE * med) irregular = true;
  }
  const c = mapping.columns;
  return {
    rows: n,
    spanS: log.t[n - 1] - log.t[0],
    startedAt: log.startedAt,
    medianIntervalS: med,
    minIntervalS: minI,
    maxIntervalS: maxI,
    irregular,
    gaps,
    noiseSigmaC: noiseSigmaFromSecondDifferences(log.pv),
    quantizationStepC: q,
    step: { timeS: step.timeS, outBeforePercent: step.outBefore, outAfterPercent: step.outAfter },
    pvRangeC: pvRange,
    columns: { time: headerName(table, c.time) ?? "", out: headerName(table, c.out) ?? "", pv: headerName(table, c.pv) ?? "", sp: headerName(table, c.sp), mode: headerName(table, c.mode) },
  };
}

export function importLog(text: string, byteSize: number, mapping: LogMapping): ImportResult {
  try {
    if (!(byteSize > 0) || typeof text !== "string" || text.trim() === "") return refuse("empty", "the file is empty: choose the CSV or TSV file the logger wrote");
    if (byteSize > MAX_UPLOAD_BYTES) return refuse("too-large", `the file is ${mebibytesText(byteSize)} MiB; the limit is ${mebibytesText(MAX_UPLOAD_BYTES)} MiB (${groupThousands(MAX_UPLOAD_BYTES)} bytes): trim the log to the bump test`);
    const read = readLogTable(text, { delimiter: mapping.delimiter, headerRow: mapping.headerRow });
    if (!read.ok) return read;
    const mapped = mapLog(read.table, mapping);
    if (!mapped.ok) return mapped;
    const summary = summarise(mapped.log, read.table, mapping);
    if ("ok" in summary) return summary;
    return { ok: true, log: mapped.log, summary };
  } catch (e) {
    // last line of defence: the checks above are meant to leave nothing that throws
    return refuse("unreadable", `the file could not be read: ${e instanceof Error ? e.message : String(e)}`);
  }
}
