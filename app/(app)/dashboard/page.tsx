import type { Metadata } from "next";
import Link from "next/link";
import type { SignedInUser } from "@/app/_lib/auth";
import { guardPage } from "@/app/_lib/guard";
import { cohortsFor, organizationName, organizationUsers, roster } from "@/db/queries";
import { CohortRoster } from "@/components/cohorts/CohortRoster";
import { AssignmentList } from "@/components/assignments/AssignmentList";
import { assignmentsFor, type AssignmentListItem } from "@/app/_lib/classroom/attempts";
import { inviteTrainee, removeTrainee } from "../cohorts/[cohortId]/actions";

export const metadata: Metadata = { title: "Dashboard" };

export default async function DashboardPage({ searchParams }: { searchParams: Promise<{ welcome?: string }> }) {
  const user = await guardPage();
  const { welcome } = await searchParams;
  const [org, cohorts] = await Promise.all([organizationName(user.organizationId), cohortsFor(user)]);
  return (
    <div className="space-y-8">
      <header>
        <p className="text-xs uppercase tracking-wide text-ink-faint">{org}</p>
        <h1 className="text-xl font-semibold" data-testid="dashboard-title">
          {user.role === "admin" ? "Organisation overview" : user.role === "instructor" ? "Your cohorts" : "Your training"}
        </h1>
        {welcome ? <p role="status" className="mt-2 text-sm text-ok">Welcome to Loopwright, {user.displayName}.</p> : null}
      </header>
      {user.role === "admin" ? <AdminPanel user={user} cohorts={cohorts} /> : null}
      {user.role === "instructor" ? <InstructorPanel cohorts={cohorts} /> : null}
      {user.role === "trainee" ? <TraineePanel cohorts={cohorts} assigned={await assignmentsFor(user)} /> : null}
    </div>
  );
}

type CohortRow = Awaited<ReturnType<typeof cohortsFor>>[number];

async function AdminPanel({ user, cohorts }: { user: SignedInUser; cohorts: CohortRow[] }) {
  const people = await organizationUsers(user.organizationId);
  const countOf = (role: string) => people.filter((p) => p.role === role && p.status === "active").length;
  return (
    <>
      <dl className="grid grid-cols-4 gap-px overflow-hidden rounded-sm border border-rule bg-rule">
        {[
          ["Admins", countOf("admin")],
          ["Instructors", countOf("instructor")],
          ["Trainees", countOf("trainee")],
          ["Cohorts", cohorts.length],
        ].map(([label, value]) => (
          <div key={label} className="bg-paper-raised px-4 py-3">
            <dt className="text-xs uppercase tracking-wide text-ink-faint">{label}</dt>
            <dd className="num text-readout">{value}</dd>
          </div>
        ))}
      </dl>
      <section>
        <h2 className="mb-2 text-sm font-semibold">Cohorts</h2>
        <CohortList cohorts={cohorts} />
        <p className="mt-3 text-sm">
          <Link href="/admin/users">Manage users</Link> · <Link href="/admin/cohorts">Manage cohorts</Link>
        </p>
      </section>
    </>
  );
}

async function InstructorPanel({ cohorts }: { cohorts: CohortRow[] }) {
  const teaching = cohorts.filter((c) => c.myRole === "instructor");
  if (teaching.length === 0) return <p className="text-sm text-ink-soft">You do not teach a cohort yet. An administrator adds you to one.</p>;
  const rosters = await Promise.all(teaching.map((c) => roster(c.id)));
  return (
    <>
      {teaching.map((c, i) => (
        <section key={c.id} className="rounded-sm border border-rule bg-paper-raised p-5">
          <h2 className="mb-1 text-base font-semibold">
            <Link href={`/cohorts/${c.id}`} className="no-underline">
              {c.name}
            </Link>
          </h2>
          <p className="num mb-4 text-xs text-ink-faint">
            {c.traineeCount} trainees · times in {c.timeZone}
          </p>
          <CohortRoster cohortId={c.id} initial={rosters[i]} invite={inviteTrainee} remove={removeTrainee} />
        </section>
      ))}
    </>
  );
}

function TraineePanel({ cohorts, assigned }: { cohorts: CohortRow[]; assigned: AssignmentListItem[] }) {
  return (
    <>
      <section>
        <h2 className="mb-2 text-sm font-semibold">Your cohorts</h2>
        {cohorts.length ? <CohortList cohorts={cohorts} /> : <p className="text-sm text-ink-soft">You are not in a cohort yet.</p>}
      </section>
      <section aria-label="Assigned drills" className="rounded-sm border border-rule bg-paper-raised p-5">
        <h2 className="mb-3 text-sm font-semibold">Assigned drills</h2>
        <AssignmentList items={assigned} audience="trainee" />
      </section>
    </>
  );
}

function CohortList({ cohorts }: { cohorts: CohortRow[] }) {
  return (
    <ul className="divide-y divide-rule border-y border-rule">
      {cohorts.map((c) => (
        <li key={c.id} className="flex justify-between py-2 text-sm">
          {c.myRole === "trainee" ? <span>{c.name}</span> : <Link href={`/cohorts/${c.id}`}>{c.name}</Link>}
          <span className="num text-ink-faint">
            {c.traineeCount} trainees · {c.timeZone}
          </span>
        </li>
      ))}
    </ul>
  );
}
