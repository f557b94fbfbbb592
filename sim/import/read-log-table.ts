/**
 * Reading an uploaded log's text into a table of trimmed cells, each row with its file line.
 * Papaparse does the splitting (quotes, line endings); we add what it leaves to us:
 * - a UTF-8 byte-order mark is stripped; CRLF and lone CR line ends are read as LF;
 * - empty lines and lines starting with '#' (comments) are skipped;
 * - "auto" delimiter: papaparse's own guess picks ',' for a decimal-comma file ("1,5;20,3"), so we
 *   choose among tab, ';' and ',' by the consistency of field counts on the first lines, preferring
 *   tab and ';' when several are consistent (a file that splits evenly on ';' and also on ',' is a
 *   decimal-comma file: a ','-separated file rarely has a ';' in every line).
 */
import Papa from "papaparse";
import type { ImportRefusal, LogMapping } from "./log-mapping";

export type Delimiter = "," | ";" | "\t";

export interface LogTable {
  delimiter: Delimiter;
  /** the header row's cells (trimmed), or null when the mapping says there is none */
  headers: string[] | null;
  rows: string[][];
  /** 1-based file line of each row (the line where the row starts) */
  lineNumbers: number[];
  /** the widest of the header and the rows */
  columnCount: number;
}

export interface ReadLogOptions {
  delimiter: LogMapping["delimiter"];
  headerRow: boolean;
}

const SAMPLE_LINES = 30;
const CANDIDATES: Delimiter[] = ["\t", ";", ","];

function isSkipped(line: string): boolean {
  const t = line.trim();
  return t === "" || t.startsWith("#");
}

/** The first data lines (comments and blanks skipped), for guessing the delimiter. */
function sampleLines(text: string): string[] {
  const out: string[] = [];
  let start = 0;
  while (start <= text.length && out.length < SAMPLE_LINES) {
    let end = text.indexOf("\n", start);
    if (end < 0) end = text.length;
    const line = text.slice(start, end).replace(/\r$/, "");
    if (!isSkipped(line)) out.push(line);
    start = end + 1;
  }
  return out;
}

/** Delimiter whose field counts are the same on all sampled lines (and above one); else the most consistent. */
export function guessDelimiter(text: string): Delimiter {
  const lines = sampleLines(text.replace(/\r\n?/g, "\n"));
  if (!lines.length) return ",";
  let best: { d: Delimiter; score: number } = { d: ",", score: -1 };
  for (const d of CANDIDATES) {
    const parsed = Papa.parse<string[]>(lines.join("\n"), { delimiter: d, skipEmptyLines: true });
    const counts = parsed.data.map((r) => r.length);
    const freq = new Map<number, number>();
    for (const c of counts) freq.set(c, (freq.get(c) ?? 0) + 1);
    let mode = 1;
    let modeN = 0;
    for (const [c, n] of freq) if (n > modeN || (n === modeN && c > mode)) [mode, modeN] = [c, n];
    if (mode < 2) continue;
    const share = modeN / Math.max(1, counts.length);
    if (share === 1) return d; // fully consistent, in order of preference
    if (share > best.score) best = { d, score: share };
  }
  return best.d;
}

function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
  return starts;
}

/** 1-based line holding character `pos` (binary search over line starts). */
function lineOf(starts: number[], pos: number): number {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid] <= pos) lo = mid;
    else hi = mid - 1;
  }
  return lo + 1;
}

function refuse(code: ImportRefusal["code"], message: string): ImportRefusal {
  return { ok: false, code, message };
}

export function readLogTable(text: string, opts: ReadLogOptions): { ok: true; table: LogTable } | ImportRefusal {
  // one line break per line (CRLF, LF or a lone CR), so line numbers are counted on "\n" alone
  const body = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).replace(/\r\n?/g, "\n");
  if (sampleLines(body).length === 0) return refuse("empty", "the file is empty or holds only comment lines (starting with #): there is no data to read");
  const delimiter: Delimiter = opts.delimiter === "auto" ? guessDelimiter(body) : opts.delimiter;
  const starts = lineStarts(body);
  const rows: string[][] = [];
  const lineNumbers: number[] = [];
  let quoteError: number | null = null;
  const blank = new RegExp(`^[\\s${delimiter === "\t" ? "\\t" : delimiter}]*$`);
  // a row starts where the previous one ended, after the lines papaparse skipped (blank, comment)
  let prevEnd = 0;
  const rowStartLine = (): number => {
    let s = prevEnd;
    for (;;) {
      const line = lineOf(starts, s);
      const lineEnd = line < starts.length ? starts[line] - 1 : body.length;
      const rest = body.slice(s, lineEnd).replace(/\r$/, "");
      if (line >= starts.length || !(blank.test(rest) || rest.trimStart().startsWith("#"))) return line;
      s = starts[line];
    }
  };
  Papa.parse<string[]>(body, {
    delimiter,
    skipEmptyLines: "greedy",
    comments: "#",
    step: (r) => {
      const line = rowStartLine();
      prevEnd = r.meta.cursor;
      const cells = r.data;
      if (quoteError === null && r.errors.some((e) => e.type === "Quotes")) quoteError = line;
      const trimmed = cells.map((c) => c.trim());
      if (trimmed.every((c) => c === "")) return; // a line of bare delimiters
      if (trimmed[0].startsWith("#")) return; // a comment indented by spaces
      rows.push(trimmed);
      lineNumbers.push(line);
    },
  });
  if (quoteError !== null) return refuse("unreadable", `line ${quoteError}: a quoted cell is not closed (a stray " character); remove it or close the quote`);
  let headers: string[] | null = null;
  let headerLine = 0;
  if (opts.headerRow) {
    headers = rows.shift() ?? null;
    headerLine = lineNumbers.shift() ?? 0;
  }
  if (!rows.length) return refuse("empty", headers ? `the file has a header (line ${headerLine}) but no data rows` : "the file holds no data rows");
  let columnCount = headers ? headers.length : 0;
  for (const r of rows) columnCount = Math.max(columnCount, r.length);
  return { ok: true, table: { delimiter, headers, rows, lineNumbers, columnCount } };
}
