/**
 * Strict reading of an absolute date-time cell. Two spellings, both common in logger exports:
 * - ISO 8601 (calendar date, extended format): "2026-03-04T10:15:30.5", "2026-03-04 10:15:30",
 *   with an optional zone "Z", "+01:00" or "+0100";
 * - day.month.year: "04.03.2026 10:15:30" (fractional seconds allowed after "." or ",").
 *
 * A time without a zone is the log's local wall time. We only need differences between rows, so
 * it is read as if it were UTC, consistently for every row: the differences are then exact except
 * across a daylight-saving change inside the log, which is NOT corrected (the clock jump shows as a
 * gap or as time going backwards, and the importer says so).
 */
export interface ParsedTimestamp {
  /** seconds since 1970-01-01T00:00:00Z (a zoneless time taken as UTC) */
  epochS: number;
  /** ISO 8601 text of the instant as read (zoneless input stays zoneless) */
  iso: string;
}

const ISO = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;
const DMY = /^(\d{1,2})\.(\d{1,2})\.(\d{4})[ T]+(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?$/;

function daysInMonth(y: number, m: number): number {
  // proleptic Gregorian leap-year rule (ISO 8601)
  const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  return [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][m - 1];
}

function pad(n: number, w = 2): string {
  return String(n).padStart(w, "0");
}

function build(y: number, mo: number, d: number, h: number, mi: number, s: number, frac: string | undefined, zone: string | undefined): ParsedTimestamp | null {
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth(y, mo) || h > 23 || mi > 59 || s > 59) return null;
  let offsetMin = 0;
  if (zone && zone.toUpperCase() !== "Z") {
    const m = /^([+-])(\d{2}):?(\d{2})?$/.exec(zone);
    if (!m) return null;
    const oh = Number(m[2]);
    const om = m[3] ? Number(m[3]) : 0;
    if (oh > 14 || om > 59) return null;
    offsetMin = (m[1] === "-" ? -1 : 1) * (oh * 60 + om);
  }
  const fracS = frac ? Number("0." + frac) : 0;
  const epochS = Date.UTC(y, mo - 1, d, h, mi, s) / 1000 - offsetMin * 60 + fracS;
  const iso = `${pad(y, 4)}-${pad(mo)}-${pad(d)}T${pad(h)}:${pad(mi)}:${pad(s)}${frac ? "." + frac : ""}${zone ? (zone.toUpperCase() === "Z" ? "Z" : zone) : ""}`;
  return { epochS, iso };
}

/** The instant in `cell`, or null when it is not one of the two accepted spellings or not a real date. */
export function parseTimestamp(cell: string): ParsedTimestamp | null {
  const s = cell.trim();
  if (s.length > 40) return null;
  let m = ISO.exec(s);
  if (m) return build(+m[1], +m[2], +m[3], +m[4], +m[5], m[6] ? +m[6] : 0, m[7], m[8]);
  m = DMY.exec(s);
  if (m) return build(+m[3], +m[2], +m[1], +m[4], +m[5], m[6] ? +m[6] : 0, m[7], undefined);
  return null;
}
