import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { assignmentsFor } from "@/app/_lib/classroom/attempts";
import { instantToZonedLocal } from "@/app/_lib/classroom/zoned-time";
import { cohortById, roster } from "@/db/queries";
import { drillsFor } from "@/db/drill-queries";
import { CohortRoster } from "@/components/cohorts/CohortRoster";
import { AssignForm, type AssignableVersion } from "@/components/assignments/AssignForm";
import { AssignmentList } from "@/components/assignments/AssignmentList";
import { createAssignment, inviteTrainee, removeTrainee } from "./actions";

export const metadata: Metadata = { title: "Cohort" };

export default async function CohortPage({ params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  const user = await guardPage({ roles: ["instructor", "admin"], cohortId, cohortRole: "instructor" });
  const cohort = (await cohortById(cohortId))!;
  const [members, assigned, drills] = await Promise.all([roster(cohortId), assignmentsFor(user, { cohortId }), drillsFor(user)]);
  const versions: AssignableVersion[] = drills
    .filter((d) => !d.archivedAt)
    .flatMap((d) => [...d.publishedVersions].reverse().map((v) => ({ drillId: d.id, version: v, label: `${d.title} — version ${v}${d.mine ? "" : ` (${d.ownerName})`}` })));
  // default window: opens now, due in a week, in the cohort's zone
  const now = new Date();
  const defaults = { opensAt: instantToZonedLocal(now, cohort.timeZone), dueAt: instantToZonedLocal(new Date(now.getTime() + 7 * 86400_000), cohort.timeZone) };
  return (
    <section className="space-y-8">
      <div>
        <p className="text-xs uppercase tracking-wide text-ink-faint">Cohort · times in {cohort.timeZone}</p>
        <h1 className="text-xl font-semibold">{cohort.name}</h1>
      </div>
      <CohortRoster cohortId={cohortId} initial={members} invite={inviteTrainee} remove={removeTrainee} />
      <section aria-label="Assignments" className="space-y-4">
        <h2 className="text-sm font-semibold">Assignments</h2>
        <AssignmentList items={assigned} audience="staff" />
        <details className="rounded-sm border border-rule bg-paper-raised p-4">
          <summary className="cursor-pointer text-sm font-medium">Assign a drill…</summary>
          <div className="mt-4">
            <AssignForm cohortId={cohortId} timeZone={cohort.timeZone} versions={versions} action={createAssignment} defaults={defaults} />
          </div>
        </details>
      </section>
    </section>
  );
}
