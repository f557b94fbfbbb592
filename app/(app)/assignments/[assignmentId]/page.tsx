import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { assignmentCohortId, cohortAccess, guardPage } from "@/app/_lib/guard";
import { assignmentById, ownAttempts } from "@/app/_lib/classroom/attempts";
import { LATE_RULES, VISIBILITY } from "@/app/_lib/classroom/assignments";
import { standings } from "@/app/_lib/classroom/standings";
import { formatInZone } from "@/app/_lib/classroom/zoned-time";
import { ActionForm } from "@/components/forms/ActionForm";
import { SelectField } from "@/components/forms/Field";
import { RubricPanel } from "@/components/assignments/RubricPanel";
import { StandingsTable } from "@/components/standings/StandingsTable";
import { AttemptStatusBadge } from "@/components/attempts/AttemptStatusBadge";
import { setStandingsVisibility, startAttempt } from "../actions";

export const metadata: Metadata = { title: "Assignment" };

export default async function AssignmentPage({ params }: { params: Promise<{ assignmentId: string }> }) {
  const { assignmentId } = await params;
  const user = await guardPage({ assignmentId, cohortRole: "member" });
  const found = await assignmentById(user, assignmentId);
  if (!found) notFound();
  const { a, drill, phase, timeZone, cohortName, drillVersion } = found;
  const cohortId = (await assignmentCohortId(user, assignmentId))!;
  const staff = user.role !== "trainee" && (await cohortAccess(user, cohortId, "instructor"));
  const trainee = user.role === "trainee";
  const [mine, initialStandings] = await Promise.all([trainee ? ownAttempts(user, a.id) : Promise.resolve([]), standings(user, staff, a.id, "best")]);
  const left = a.attemptLimit - mine.length;
  const open = mine.find((m) => m.status === "started");
  const canStart = trainee && left > 0 && (phase === "open" || phase === "late");
  return (
    <div className="space-y-8">
      <header className="space-y-1">
        <p className="text-xs uppercase tracking-wide text-ink-faint">
          Assignment · {cohortName} · times in {timeZone}
        </p>
        <h1 className="text-xl font-semibold">{a.title}</h1>
        <p className="num text-sm text-ink-soft">
          {drill.title} · version {drillVersion} · opens {formatInZone(a.opensAt, timeZone)} · due {formatInZone(a.dueAt, timeZone)} · {a.attemptLimit} attempt{a.attemptLimit === 1 ? "" : "s"} each ·{" "}
          {LATE_RULES[a.lateRule].toLowerCase()}
          {a.lateRule === "accept-penalty" ? ` (−${a.latePenaltyPercent} %)` : ""}
        </p>
        {drill.description ? <p className="max-w-3xl text-sm text-ink-soft">{drill.description}</p> : null}
      </header>

      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_26rem]">
        <RubricPanel drill={drill} />
        {trainee ? (
          <section aria-label="Your attempts" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4">
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Your attempts</h2>
            <p className="num text-sm" data-testid="attempts-left">
              {Math.max(0, left)} of {a.attemptLimit} left
            </p>
            {open ? (
              <Link href={`/attempts/${open.id}`} className="inline-block rounded-sm bg-ink px-3 py-2 text-sm text-paper no-underline">
                Continue attempt {open.number}
              </Link>
            ) : null}
            {canStart && !open ? (
              <ActionForm action={startAttempt} submitLabel="Start an attempt" className="space-y-2">
                <input type="hidden" name="assignmentId" value={a.id} />
                <p className="text-xs text-ink-faint">Starting counts against your limit at once, even if you leave the attempt unfinished.</p>
              </ActionForm>
            ) : null}
            {phase === "not-open" ? <p className="text-sm text-ink-soft">Opens {formatInZone(a.opensAt, timeZone)}.</p> : null}
            {phase === "closed" ? <p className="text-sm text-ink-soft">Past its due date; late attempts are not accepted.</p> : null}
            {mine.length ? (
              <ul className="divide-y divide-rule border-y border-rule text-sm">
                {mine.map((m) => (
                  <li key={m.id} className="flex items-center justify-between gap-3 py-2">
                    <Link href={`/attempts/${m.id}`}>Attempt {m.number}</Link>
                    <span className="flex items-center gap-2">
                      {m.late ? <span className="rounded-sm border border-rule-strong px-1 text-xs text-ink-soft">late</span> : null}
                      <AttemptStatusBadge status={m.status} />
                      <span className="num w-12 text-right">{m.score === null ? "—" : m.score.toFixed(1)}</span>
                    </span>
                  </li>
                ))}
              </ul>
            ) : null}
          </section>
        ) : staff ? (
          <section aria-label="Standings settings" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4">
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">What trainees see</h2>
            <ActionForm action={setStandingsVisibility} submitLabel="Save" className="space-y-3">
              <input type="hidden" name="assignmentId" value={a.id} />
              <SelectField label="Standings for trainees" name="visibility" defaultValue={a.visibility} options={Object.entries(VISIBILITY).map(([value, label]) => ({ value, label }))} />
            </ActionForm>
            <p className="text-xs text-ink-faint">Staff always see full names and flags. Trainees removed from the roster keep their attempts on record but leave the standings.</p>
          </section>
        ) : null}
      </div>

      <section aria-label="Standings" className="space-y-2">
        <h2 className="text-sm font-semibold">Standings</h2>
        <StandingsTable assignmentId={a.id} initial={initialStandings ?? undefined} csvHref={staff ? `/api/assignments/${a.id}/standings/csv` : undefined} />
      </section>
    </div>
  );
}
