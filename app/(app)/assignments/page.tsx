import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { assignmentsFor } from "@/app/_lib/classroom/attempts";
import { cohortsFor } from "@/db/queries";
import { AssignmentList } from "@/components/assignments/AssignmentList";

export const metadata: Metadata = { title: "Assignments" };

export default async function AssignmentsPage() {
  const user = await guardPage();
  if (user.role === "trainee") {
    const items = await assignmentsFor(user);
    return (
      <section className="space-y-4">
        <h1 className="text-xl font-semibold">Assignments</h1>
        <AssignmentList items={items} audience="trainee" />
      </section>
    );
  }
  const cohorts = (await cohortsFor(user)).filter((c) => c.myRole !== "trainee");
  const lists = await Promise.all(cohorts.map(async (c) => ({ cohort: c, items: await assignmentsFor(user, { cohortId: c.id }) })));
  return (
    <section className="space-y-8">
      <h1 className="text-xl font-semibold">Assignments</h1>
      {lists.length === 0 ? <p className="text-sm text-ink-soft">You instruct no cohort yet.</p> : null}
      {lists.map(({ cohort, items }) => (
        <section key={cohort.id} className="space-y-2">
          <h2 className="text-sm font-semibold">
            <a href={`/cohorts/${cohort.id}`}>{cohort.name}</a> <span className="font-normal text-ink-faint">· assign drills from the cohort page</span>
          </h2>
          <AssignmentList items={items} audience="staff" />
        </section>
      ))}
    </section>
  );
}
