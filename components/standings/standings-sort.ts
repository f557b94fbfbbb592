/**
 * Pure helpers for the standings table: sort rows by a column (values that do not exist, such as a
 * settling time of a loop that never settled, always sort last whatever the direction) and filter
 * them by trainee label and flags.
 */
import type { StandingsRow } from "@/app/_lib/classroom/contracts";

export type StandingsSortKey =
  | "rank"
  | "trainee"
  | "score"
  | "settlingTimeS"
  | "overshootC"
  | "iae"
  | "recoveryTimeS"
  | "energyKWh"
  | "attemptsUsed"
  | "submittedAt";

export type SortDirection = "asc" | "desc";

export interface StandingsSort {
  key: StandingsSortKey;
  direction: SortDirection;
}

/** The direction a column sorts in on its first click: higher scores first, otherwise smallest first. */
export function defaultDirection(key: StandingsSortKey): SortDirection {
  return key === "score" ? "desc" : "asc";
}

/** The value a row sorts on; null when it does not exist. */
export function sortValue(row: StandingsRow, key: StandingsSortKey): number | string | null {
  switch (key) {
    case "rank":
      return row.rank;
    case "trainee":
      return row.traineeLabel.toLocaleLowerCase();
    case "score":
      return row.summary.score;
    case "settlingTimeS":
      return row.summary.settlingTimeS;
    case "overshootC":
      return row.summary.overshootC;
    case "iae":
      return row.summary.iae;
    case "recoveryTimeS":
      return row.summary.recoveryTimeS;
    case "energyKWh":
      return row.summary.energyKWh;
    case "attemptsUsed":
      return row.attemptsUsed;
    case "submittedAt": {
      const t = Date.parse(row.submittedAt);
      return Number.isFinite(t) ? t : null;
    }
  }
}

/** A copy sorted by `sort`; nulls last in both directions; ties keep rank order (then the input order). */
export function sortStandings(rows: readonly StandingsRow[], sort: StandingsSort): StandingsRow[] {
  const sign = sort.direction === "asc" ? 1 : -1;
  return rows
    .map((row, i) => ({ row, i, v: sortValue(row, sort.key) }))
    .sort((a, b) => {
      if (a.v === null || b.v === null || (typeof a.v === "number" && Number.isNaN(a.v)) || (typeof b.v === "number" && Number.isNaN(b.v))) {
        const an = a.v === null || Number.isNaN(a.v as number);
        const bn = b.v === null || Number.isNaN(b.v as number);
        if (an !== bn) return an ? 1 : -1;
      } else if (a.v !== b.v) {
        const c = typeof a.v === "string" && typeof b.v === "string" ? a.v.localeCompare(b.v) : (a.v as number) - (b.v as number);
        if (c !== 0) return sign * c;
      }
      return a.row.rank - b.row.rank || a.i - b.i;
    })
    .map((x) => x.row);
}

export interface StandingsFilter {
  /** substring of the trainee's name or initials, case-insensitive; blank = all */
  text?: string;
  hideFlagged?: boolean;
  lateOnly?: boolean;
}

/** The rows that pass the filter (order kept). */
export function filterStandings(rows: readonly StandingsRow[], filter: StandingsFilter): StandingsRow[] {
  const needle = (filter.text ?? "").trim().toLocaleLowerCase();
  return rows.filter((r) => {
    if (needle && !r.traineeLabel.toLocaleLowerCase().includes(needle)) return false;
    if (filter.hideFlagged && r.flagged) return false;
    if (filter.lateOnly && !r.late) return false;
    return true;
  });
}
