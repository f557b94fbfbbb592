/**
 * Reads a bump-test log as CSV text (pure: the Bench uses it for uploads, the CLI for files).
 * - Separator: comma, semicolon or tab (whichever the header line uses most).
 * - Lines that are empty or start with '#' are ignored.
 * - With a header, the columns are found by name (case and units ignored): time "t", "time",
 *   "timeS", "time_s"…; OUT "out", "out%", "outPercent", "output"; PV "pv", "pvC", "pvFiltered",
 *   "temperature", "temp". Without a header (first line all numbers) the first three columns
 *   are taken as time, OUT, PV.
 */
import type { StepRecord } from "./step-record";

export type CsvRecord = { ok: true; record: StepRecord; columns: { time: string; out: string; pv: string } } | { ok: false; message: string };

const NAMES = {
  time: ["t", "time", "times", "timesec", "seconds", "secs", "s"],
  out: ["out", "output", "outpercent", "outpct", "op", "mv", "power"],
  pv: ["pv", "pvc", "pvfiltered", "pvfilteredc", "pvraw", "pvrawc", "temperature", "temp", "tempc", "y"],
};

function normalise(h: string): string {
  return h
    .trim()
    .replace(/^"|"$/g, "")
    .toLowerCase()
    .replace(/\[.*?\]|\(.*?\)/g, "")
    .replace(/[%°\s_\-.]/g, "");
}

function pick(headers: string[], names: string[]): number {
  const norm = headers.map(normalise);
  for (const n of names) {
    const i = norm.indexOf(n);
    if (i >= 0) return i;
  }
  return -1;
}

export function parseStepRecordCsv(text: string): CsvRecord {
  const lines = text.split(/\r?\n/).map((l, i) => ({ l: l.trim(), n: i + 1 })).filter((x) => x.l !== "" && !x.l.startsWith("#"));
  if (!lines.length) return { ok: false, message: "the file has no data lines" };
  const first = lines[0].l;
  const sep = [",", ";", "\t"].map((s) => ({ s, c: first.split(s).length })).sort((a, b) => b.c - a.c)[0].s;
  const cells0 = first.split(sep).map((c) => c.trim());
  const numeric = (c: string) => c !== "" && Number.isFinite(Number(c));
  let cols: [number, number, number];
  let names: { time: string; out: string; pv: string };
  let data = lines;
  if (cells0.every(numeric)) {
    if (cells0.length < 3) return { ok: false, message: `expected three columns (time, OUT, PV); line ${lines[0].n} has ${cells0.length}` };
    cols = [0, 1, 2];
    names = { time: "column 1", out: "column 2", pv: "column 3" };
  } else {
    const it = pick(cells0, NAMES.time);
    const io = pick(cells0, NAMES.out);
    const ip = pick(cells0, NAMES.pv);
    const missing = [it < 0 ? "time" : "", io < 0 ? "OUT" : "", ip < 0 ? "PV" : ""].filter(Boolean);
    if (missing.length)
      return { ok: false, message: `cannot find the ${missing.join(", ")} column(s) in the header "${first}" (expected names like time, out, pv)` };
    cols = [it, io, ip];
    names = { time: cells0[it], out: cells0[io], pv: cells0[ip] };
    data = lines.slice(1);
  }
  const t: number[] = [];
  const out: number[] = [];
  const pv: number[] = [];
  for (const { l, n } of data) {
    const c = l.split(sep).map((x) => x.trim().replace(/^"|"$/g, ""));
    const vals = cols.map((k) => (k < c.length ? c[k] : ""));
    for (let j = 0; j < 3; j++)
      if (!numeric(vals[j])) return { ok: false, message: `line ${n}: the ${["time", "OUT", "PV"][j]} cell "${vals[j]}" is not a number` };
    t.push(Number(vals[0]));
    out.push(Number(vals[1]));
    pv.push(Number(vals[2]));
  }
  return { ok: true, record: { t, out, pv }, columns: names };
}
