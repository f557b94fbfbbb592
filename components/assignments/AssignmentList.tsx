import Link from "next/link";
import type { AssignmentListItem } from "@/app/_lib/classroom/attempts";
import { formatInZone } from "@/app/_lib/classroom/zoned-time";

const PHASE_LABEL: Record<AssignmentListItem["phase"], string> = {
  "not-open": "opens later",
  open: "open",
  late: "past due · late accepted",
  closed: "closed",
};

/** Assignments as a table: for a trainee with attempts left and best result, for staff with the dates. */
export function AssignmentList({ items, audience }: { items: AssignmentListItem[]; audience: "trainee" | "staff" }) {
  if (items.length === 0) {
    return <p className="text-sm text-ink-soft">{audience === "trainee" ? "No drills assigned yet. When your instructor opens one for your cohort it is listed here with its due date and attempts left." : "Nothing assigned to this cohort yet."}</p>;
  }
  return (
    <table className="w-full border-collapse text-sm" data-testid="assignment-list">
      <thead>
        <tr className="border-b border-rule-strong text-left text-xs uppercase tracking-wide text-ink-faint">
          <th className="py-2 pr-4 font-medium">Assignment</th>
          {audience === "trainee" ? <th className="py-2 pr-4 font-medium">Cohort</th> : <th className="py-2 pr-4 font-medium">Opens</th>}
          <th className="py-2 pr-4 font-medium">Due</th>
          <th className="py-2 pr-4 font-medium">Status</th>
          {audience === "trainee" ? (
            <>
              <th className="py-2 pr-4 text-right font-medium">Attempts left</th>
              <th className="py-2 text-right font-medium">Best score</th>
            </>
          ) : (
            <th className="py-2 text-right font-medium">Attempts each</th>
          )}
        </tr>
      </thead>
      <tbody>
        {items.map((a) => (
          <tr key={a.id} className="border-b border-rule">
            <td className="py-2 pr-4">
              <Link href={`/assignments/${a.id}`} className="font-medium">
                {a.title}
              </Link>
              <span className="block text-xs text-ink-faint">
                {a.drillTitle} · version {a.drillVersion}
              </span>
            </td>
            {audience === "trainee" ? <td className="py-2 pr-4 text-ink-soft">{a.cohortName}</td> : <td className="num py-2 pr-4 text-xs">{formatInZone(a.opensAt, a.timeZone)}</td>}
            <td className="num py-2 pr-4 text-xs">{formatInZone(a.dueAt, a.timeZone)}</td>
            <td className="py-2 pr-4 text-ink-soft">
              {PHASE_LABEL[a.phase]}
              {audience === "trainee" && a.verifying ? <span className="ml-2 text-xs text-ink-faint">· {a.verifying} verifying…</span> : null}
            </td>
            {audience === "trainee" ? (
              <>
                <td className="num py-2 pr-4 text-right">{Math.max(0, a.attemptLimit - a.attemptsUsed)} of {a.attemptLimit}</td>
                <td className="num py-2 text-right">{a.bestScore === null ? "—" : a.bestScore.toFixed(1)}</td>
              </>
            ) : (
              <td className="num py-2 text-right">{a.attemptLimit}</td>
            )}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
