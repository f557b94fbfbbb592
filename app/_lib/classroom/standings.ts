// Standings of an assignment: verified attempts of the cohort's current trainees (a trainee
// removed from the roster keeps their attempts, hidden here), best per trainee by default (highest
// score, the earlier submission on a tie) or every attempt. Staff see names and flags; trainees
// see what the assignment's visibility allows: full names, initials, or only their own rank.
import { createHash } from "node:crypto";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import type { SignedInUser } from "../auth";
import type { StandingsResponse, StandingsRow, StandingsVisibility } from "./contracts";
import { summaryOf } from "./attempts";

type Viewer = Pick<SignedInUser, "id">;

export function initialsOf(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  return parts.map((p) => p[0]!.toUpperCase() + ".").join(" ") || "?";
}

type RawRow = {
  attempt_id: string;
  trainee_id: string;
  display_name: string;
  number: number;
  used: number;
  submitted_at: Date;
  late: boolean;
  flagged: boolean;
  // the summary columns, named as summaryOf (attempts.ts) reads them
  score: number;
  rawScore: number | null;
  settlingTimeS: number | null;
  overshootC: number | null;
  iae: number | null;
  recoveryTimeS: number | null;
  energyKWh: number | null;
  safetyTrips: number | null;
};

/**
 * What decides the standings' rows, read cheaply: attempts by status and their latest verification,
 * and the cohort's roster changes. Equal stamps mean equal rows, so the rows are memoised per
 * process under it (the app servers stay stateless: a memo is only ever a cache of the database).
 */
async function stampOf(assignmentId: string): Promise<string> {
  // each part is an index lookup (migration 0004), not a scan of the assignment's attempts
  const [r] = await getDb().execute<{ stamp: string }>(sql`
    select concat_ws('|',
      (select max(verified_at) from attempts where assignment_id = ${assignmentId}),
      (select max(created_at) from attempts where assignment_id = ${assignmentId}),
      (select count(*) from attempts where assignment_id = ${assignmentId} and status = 'submitted'),
      (select concat_ws(':', count(*), count(removed_at), max(removed_at), max(joined_at))
         from cohort_memberships m join assignments a on a.cohort_id = m.cohort_id where a.id = ${assignmentId})
    ) as stamp`);
  return r.stamp;
}

/**
 * An entity tag of what this viewer would be answered: the rows' stamp, the assignment's settings
 * and who is asking. The route answers 304 to a matching If-None-Match, so a polling standings
 * page (SWR through the browser's HTTP cache) costs two small queries while nothing changes.
 */
export async function standingsEtag(viewer: Viewer, staff: boolean, assignmentId: string, view: "best" | "all"): Promise<{ etag: string; stamp: string }> {
  const [a] = await getDb().execute<{ v: string }>(sql`select concat_ws('|', title, visibility, due_at, attempt_limit) as v from assignments where id = ${assignmentId}`);
  const stamp = await stampOf(assignmentId);
  const h = createHash("sha256").update([stamp, a?.v ?? "", view, staff ? "staff" : viewer.id].join("\n")).digest("base64url");
  return { etag: `"${h.slice(0, 27)}"`, stamp };
}

const MEMO_LIMIT = 200;
const memo = new Map<string, { stamp: string; rows: RawRow[]; verifying: number }>();

/** Current trainees' verified attempts, best per trainee or all, ranked by score (earlier first on a tie). */
async function rankedRows(assignmentId: string, view: "best" | "all", knownStamp?: string): Promise<{ rows: RawRow[]; verifying: number }> {
  const stamp = knownStamp ?? (await stampOf(assignmentId));
  const key = `${assignmentId}:${view}`;
  const hit = memo.get(key);
  if (hit && hit.stamp === stamp) return hit;
  const db = getDb();
  // current trainees only; attempts used counts every started attempt; only the summary columns
  // are read (the official documents are large and the sort does not need them)
  const rows = [
    ...(await db.execute<RawRow>(sql`
    with members as (
      select m.user_id from cohort_memberships m join assignments a on a.cohort_id = m.cohort_id
      where a.id = ${assignmentId} and m.role = 'trainee' and m.removed_at is null
    ),
    used as (
      select trainee_id, count(*)::int as used from attempts where assignment_id = ${assignmentId} group by trainee_id
    ),
    verified as (
      select t.id, t.trainee_id, t.number, t.submitted_at, t.late, t.flagged, t.score, t.raw_score, t.settling_time_s, t.overshoot_c,
             t.iae, t.recovery_time_s, t.energy_kwh, t.safety_trips
      from attempts t join members m on m.user_id = t.trainee_id
      where t.assignment_id = ${assignmentId} and t.status = 'verified'
    ),
    chosen as (
      ${view === "best" ? sql`select distinct on (trainee_id) * from verified order by trainee_id, score desc, submitted_at asc` : sql`select * from verified`}
    )
    select c.id as attempt_id, c.trainee_id, u.display_name, c.number, coalesce(used.used, 0) as used, c.submitted_at, c.late, c.flagged,
           c.score, c.raw_score as "rawScore", c.settling_time_s as "settlingTimeS", c.overshoot_c as "overshootC", c.iae,
           c.recovery_time_s as "recoveryTimeS", c.energy_kwh as "energyKWh", c.safety_trips as "safetyTrips"
    from chosen c join users u on u.id = c.trainee_id left join used on used.trainee_id = c.trainee_id
    order by c.score desc, c.submitted_at asc
  `)),
  ];
  const [{ verifying }] = await db.execute<{ verifying: number }>(
    sql`select count(*)::int as verifying from attempts t join cohort_memberships m on m.user_id = t.trainee_id join assignments a on a.id = t.assignment_id and a.cohort_id = m.cohort_id
        where t.assignment_id = ${assignmentId} and t.status = 'submitted' and m.removed_at is null`,
  );
  const entry = { stamp, rows, verifying: Number(verifying) };
  if (memo.size >= MEMO_LIMIT) memo.delete(memo.keys().next().value!);
  memo.set(key, entry);
  return entry;
}

/** `stamp`: the change stamp already read for this request (standingsEtag), so it is not read twice. */
export async function standings(viewer: Viewer, staff: boolean, assignmentId: string, view: "best" | "all", stamp?: string): Promise<StandingsResponse | null> {
  const db = getDb();
  const [a] = await db.execute<{ id: string; title: string; visibility: StandingsVisibility; due_at: Date; attempt_limit: number; time_zone: string; kinds: string[] | null }>(
    sql`select a.id, a.title, a.visibility, a.due_at, a.attempt_limit, c.time_zone,
               (select array_agg(distinct w->>'kind') from jsonb_array_elements(v.document->'scoring'->'windows') w) as kinds
        from assignments a join cohorts c on c.id = a.cohort_id join drill_versions v on v.id = a.drill_version_id where a.id = ${assignmentId}`,
  );
  if (!a) return null;
  const { rows, verifying } = await rankedRows(assignmentId, view, stamp);
  const visibility = a.visibility;
  const out: StandingsRow[] = [];
  let rank = 0;
  let prevScore: number | null = null;
  rows.forEach((r, i) => {
    // standard competition ranking: equal scores share a rank
    if (prevScore === null || r.score !== prevScore) rank = i + 1;
    prevScore = r.score;
    const isViewer = r.trainee_id === viewer.id;
    if (!staff && visibility === "own-rank" && !isViewer) return;
    out.push({
      rank,
      attemptId: staff || isViewer ? r.attempt_id : null,
      traineeLabel: staff || visibility === "names" || isViewer ? r.display_name : initialsOf(r.display_name),
      isViewer,
      attemptNumber: r.number,
      attemptsUsed: Number(r.used),
      submittedAt: new Date(r.submitted_at).toISOString(),
      late: r.late,
      flagged: staff ? r.flagged : false,
      summary: summaryOf(r),
    });
  });
  const rankedTrainees = view === "best" ? rows.length : new Set(rows.map((r) => r.trainee_id)).size;
  return {
    assignment: {
      id: a.id,
      title: a.title,
      visibility,
      dueAt: new Date(a.due_at).toISOString(),
      attemptLimit: a.attempt_limit,
      timeZone: a.time_zone,
      windowKinds: { setpoint: (a.kinds ?? []).includes("setpoint"), disturbance: (a.kinds ?? []).includes("disturbance") },
    },
    viewer: { staff },
    view,
    rankedTrainees,
    verifying,
    rows: out,
    generatedAt: new Date().toISOString(),
  };
}

const csvCell = (v: string | number | boolean | null) => {
  if (v === null) return "";
  const s = String(v);
  // quote when needed; a leading = + - @ is prefixed so a spreadsheet does not run it as a formula (OWASP CSV injection, from memory)
  const safe = /^[=+\-@]/.test(s) && typeof v === "string" ? `'${s}` : s;
  return /[",\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};

/** The staff's CSV export: one row per standings row, SI units in the header. */
export function standingsCsv(s: StandingsResponse): string {
  const header = ["rank", "trainee", "attempt", "attempts_used", "submitted_utc", "late", "flagged", "score", "raw_score", "settling_time_s", "overshoot_c", "iae_c_s", "recovery_time_s", "energy_kwh", "safety_trips"];
  const lines = s.rows.map((r) =>
    [r.rank, r.traineeLabel, r.attemptNumber, r.attemptsUsed, r.submittedAt, r.late, r.flagged, r.summary.score, r.summary.rawScore, r.summary.settlingTimeS, r.summary.overshootC, r.summary.iae, r.summary.recoveryTimeS, r.summary.energyKWh, r.summary.safetyTrips].map(csvCell).join(","),
  );
  return [header.join(","), ...lines].join("\r\n") + "\r\n";
}
