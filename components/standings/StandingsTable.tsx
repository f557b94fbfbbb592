"use client";
/**
 * The standings of an assignment, fetched with SWR from the route handler and refreshed every few
 * seconds so newly verified attempts appear without a reload. Best attempt per trainee or every
 * attempt; sortable columns (measures that do not exist sort last); a filter for staff.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import type { StandingsResponse, StandingsRow } from "@/app/_lib/classroom/contracts";
import { formatElapsed } from "@/components/trend/format";
import { defaultDirection, filterStandings, sortStandings, type StandingsSort, type StandingsSortKey } from "./standings-sort";

export interface StandingsTableProps {
  assignmentId: string;
  initial?: StandingsResponse;
  /** refresh interval, ms (default 5000) */
  refreshMs?: number;
  /** staff: the CSV export's address */
  csvHref?: string;
}

const fetchStandings = async (url: string): Promise<StandingsResponse> => {
  const res = await fetch(url, { cache: "no-store" });
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

const COLUMNS: { key: StandingsSortKey; label: string; numeric: boolean }[] = [
  { key: "rank", label: "Rank", numeric: true },
  { key: "trainee", label: "Trainee", numeric: false },
  { key: "score", label: "Score", numeric: true },
  { key: "settlingTimeS", label: "Settling", numeric: true },
  { key: "overshootC", label: "Overshoot", numeric: true },
  { key: "iae", label: "IAE", numeric: true },
  { key: "recoveryTimeS", label: "Dist. recovery", numeric: true },
  { key: "energyKWh", label: "Energy", numeric: true },
  { key: "attemptsUsed", label: "Attempts", numeric: true },
  { key: "submittedAt", label: "Submitted", numeric: false },
];

const clock = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", minute: "2-digit", second: "2-digit", hour12: false });

function submittedFormat(timeZone: string | undefined) {
  try {
    return new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone });
  } catch {
    return new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
  }
}

function Tag({ kind }: { kind: "flagged" | "late" }) {
  return kind === "flagged" ? (
    <span className="ml-2 rounded-sm bg-alarm-soft px-1 text-xs text-alarm" data-testid="tag-flagged">
      flagged
    </span>
  ) : (
    <span className="ml-2 rounded-sm border border-rule-strong px-1 text-xs text-ink-soft" data-testid="tag-late">
      late
    </span>
  );
}

function Cells({ row, view, fmtDate, windows }: { row: StandingsRow; view: "best" | "all"; fmtDate: Intl.DateTimeFormat; windows: StandingsResponse["assignment"]["windowKinds"] }) {
  const s = row.summary;
  const label = view === "all" ? `${row.traineeLabel} · attempt ${row.attemptNumber}` : row.traineeLabel;
  return (
    <>
      <td className="num py-1.5 pr-3">{row.rank}</td>
      <td className="py-1.5 pr-3">
        {row.attemptId ? <Link href={`/attempts/${row.attemptId}`}>{label}</Link> : label}
        {row.isViewer ? <span className="ml-2 text-xs text-ink-faint">(you)</span> : null}
        {row.flagged ? <Tag kind="flagged" /> : null}
        {row.late ? <Tag kind="late" /> : null}
      </td>
      <td className="num py-1.5 pr-3 font-medium">{s.score.toFixed(1)}</td>
      <td className="num py-1.5 pr-3">{!windows.setpoint ? "—" : s.settlingTimeS === null ? <span className="font-sans text-ink-faint">not settled</span> : `${formatElapsed(s.settlingTimeS)}`}</td>
      <td className="num py-1.5 pr-3">{s.overshootC === null ? "—" : `${s.overshootC.toFixed(2)} °C`}</td>
      <td className="num py-1.5 pr-3">{`${s.iae.toFixed(0)} °C·s`}</td>
      <td className="num py-1.5 pr-3">{!windows.disturbance ? "—" : s.recoveryTimeS === null ? <span className="font-sans text-ink-faint">not recovered</span> : formatElapsed(s.recoveryTimeS)}</td>
      <td className="num py-1.5 pr-3">{`${s.energyKWh.toFixed(2)} kWh`}</td>
      <td className="num py-1.5 pr-3">{row.attemptsUsed}</td>
      <td className="num py-1.5 text-ink-soft">{fmtDate.format(new Date(row.submittedAt))}</td>
    </>
  );
}

/** Standings of one assignment (see the file comment). */
export function StandingsTable({ assignmentId, initial, refreshMs = 5000, csvHref }: StandingsTableProps) {
  const [view, setView] = useState<"best" | "all">(initial?.view ?? "best");
  const [sort, setSort] = useState<StandingsSort>({ key: "rank", direction: "asc" });
  const [text, setText] = useState("");
  const [hideFlagged, setHideFlagged] = useState(false);
  const [lateOnly, setLateOnly] = useState(false);
  const key = `/api/assignments/${assignmentId}/standings?view=${view}`;
  const { data, error } = useSWR<StandingsResponse>(key, fetchStandings, {
    refreshInterval: refreshMs,
    fallbackData: initial && initial.view === view ? initial : undefined,
    keepPreviousData: true,
  });

  const rows = useMemo(() => (data ? sortStandings(filterStandings(data.rows, { text, hideFlagged, lateOnly }), sort) : []), [data, text, hideFlagged, lateOnly, sort]);
  const fmtDate = useMemo(() => submittedFormat(data?.assignment.timeZone), [data?.assignment.timeZone]);

  const staff = !!data?.viewer.staff;
  const ownRank = !!data && !staff && data.assignment.visibility === "own-rank";
  const shownView = data?.view ?? view;

  const clickHeader = (k: StandingsSortKey) =>
    setSort((s) => (s.key === k ? { key: k, direction: s.direction === "asc" ? "desc" : "asc" } : { key: k, direction: defaultDirection(k) }));

  const status = (
    <p className="flex flex-wrap gap-x-4 text-xs text-ink-faint">
      {data && data.verifying > 0 ? (
        <span data-testid="standings-verifying" className="animate-pulse">
          {data.verifying} {data.verifying === 1 ? "attempt" : "attempts"} verifying…
        </span>
      ) : null}
      {data ? <span className="num">updated {clock.format(new Date(data.generatedAt))}</span> : null}
      {error ? (
        <span role="alert" className="text-ink-soft">
          Standings could not be refreshed: {String((error as Error).message)}
        </span>
      ) : null}
    </p>
  );

  if (ownRank) {
    const mine = data.rows.find((r) => r.isViewer) ?? data.rows[0];
    return (
      <div className="space-y-2" data-testid="standings-table">
        {mine ? (
          <>
            <p className="text-sm" data-testid="standings-own-rank">
              Your rank: <span className="num font-semibold">{mine.rank}</span> of <span className="num">{data.rankedTrainees}</span>
            </p>
            <table className="w-full border-collapse text-sm">
              <tbody>
                <tr className="border-y border-rule bg-paper-sunk" data-testid="standings-row" data-viewer="true">
                  <Cells row={mine} view="best" fmtDate={fmtDate} windows={data.assignment.windowKinds} />
                </tr>
              </tbody>
            </table>
          </>
        ) : (
          <p className="text-sm text-ink-soft">You have no verified attempt yet; your rank appears here once one is verified.</p>
        )}
        {status}
      </div>
    );
  }

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <div role="group" aria-label="Standings view" className="flex">
          {(
            [
              ["best", "Best per trainee"],
              ["all", "All attempts"],
            ] as const
          ).map(([v, label], i) => (
            <button
              key={v}
              type="button"
              aria-pressed={view === v}
              onClick={() => setView(v)}
              className={`border px-2 py-0.5 text-xs ${i === 0 ? "rounded-l-sm" : "-ml-px rounded-r-sm"} ${view === v ? "border-ink bg-ink text-paper" : "border-rule-strong hover:border-ink"}`}
            >
              {label}
            </button>
          ))}
        </div>
        <label className="flex items-center gap-1 text-xs text-ink-soft">
          <span>Filter</span>
          <input
            type="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder="trainee"
            aria-label="Filter by trainee"
            className="w-36 rounded-sm border border-rule-strong bg-paper-raised px-2 py-0.5 text-sm"
          />
        </label>
        {staff ? (
          <>
            <label className="flex items-center gap-1 text-xs text-ink-soft">
              <input type="checkbox" checked={hideFlagged} onChange={(e) => setHideFlagged(e.target.checked)} /> hide flagged
            </label>
            <label className="flex items-center gap-1 text-xs text-ink-soft">
              <input type="checkbox" checked={lateOnly} onChange={(e) => setLateOnly(e.target.checked)} /> late only
            </label>
          </>
        ) : null}
        {csvHref ? (
          <a href={csvHref} className="ml-auto text-xs underline decoration-rule-strong underline-offset-2 hover:decoration-ink" download>
            Export CSV
          </a>
        ) : null}
      </div>
      {status}
      <table className="w-full border-collapse text-sm" data-testid="standings-table" data-view={shownView}>
        <thead>
          <tr className="border-b border-rule-strong text-left text-xs uppercase tracking-wide text-ink-faint">
            {COLUMNS.map((c) => {
              const active = sort.key === c.key;
              return (
                <th key={c.key} className="py-2 pr-3 font-medium" aria-sort={active ? (sort.direction === "asc" ? "ascending" : "descending") : "none"}>
                  <button type="button" onClick={() => clickHeader(c.key)} className="uppercase tracking-wide hover:text-ink">
                    {c.label}
                    <span aria-hidden="true" className="ml-0.5 inline-block w-2">
                      {active ? (sort.direction === "asc" ? "▲" : "▼") : ""}
                    </span>
                  </button>
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr
              key={`${r.attemptId ?? r.traineeLabel}-${r.attemptNumber}-${r.rank}`}
              className={`border-b border-rule ${r.isViewer ? "bg-paper-sunk" : ""}`}
              data-testid="standings-row"
              data-viewer={r.isViewer ? "true" : undefined}
            >
              <Cells row={r} view={shownView} fmtDate={fmtDate} windows={data!.assignment.windowKinds} />
            </tr>
          ))}
          {!data && !error ? (
            <tr>
              <td colSpan={COLUMNS.length} className="py-4 text-ink-faint">
                Loading standings…
              </td>
            </tr>
          ) : null}
          {data && rows.length === 0 ? (
            <tr>
              <td colSpan={COLUMNS.length} className="py-4 text-ink-faint">
                {data.rows.length === 0 ? "No verified attempts yet." : "No attempt matches the filter."}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
