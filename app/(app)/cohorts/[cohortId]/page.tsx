import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { cohortById, roster } from "@/db/queries";
import { CohortRoster } from "@/components/cohorts/CohortRoster";
import { inviteTrainee, removeTrainee } from "./actions";

export const metadata: Metadata = { title: "Cohort" };

export default async function CohortPage({ params }: { params: Promise<{ cohortId: string }> }) {
  const { cohortId } = await params;
  await guardPage({ roles: ["instructor", "admin"], cohortId, cohortRole: "instructor" });
  const cohort = (await cohortById(cohortId))!;
  return (
    <section>
      <p className="text-xs uppercase tracking-wide text-ink-faint">Cohort · times in {cohort.timeZone}</p>
      <h1 className="mb-6 text-xl font-semibold">{cohort.name}</h1>
      <CohortRoster cohortId={cohortId} initial={await roster(cohortId)} invite={inviteTrainee} remove={removeTrainee} />
    </section>
  );
}
