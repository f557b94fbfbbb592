import type { Metadata } from "next";
import Link from "next/link";
import { guardPage } from "@/app/_lib/guard";
import { cohortsFor, organizationUsers } from "@/db/queries";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field, SelectField } from "@/components/forms/Field";
import { addInstructor, createCohort } from "../actions";

export const metadata: Metadata = { title: "Cohorts" };

const zones = ["UTC", ...Intl.supportedValuesOf("timeZone")];

export default async function AdminCohortsPage() {
  const admin = await guardPage({ roles: ["admin"] });
  const [cohorts, people] = await Promise.all([cohortsFor(admin), organizationUsers(admin.organizationId)]);
  const instructors = people.filter((p) => p.role === "instructor" && p.status === "active");
  return (
    <div className="grid gap-10 lg:grid-cols-[1fr_20rem]">
      <section>
        <h1 className="mb-4 text-xl font-semibold">Cohorts</h1>
        <ul className="divide-y divide-rule border-y border-rule">
          {cohorts.map((c) => (
            <li key={c.id} className="flex justify-between py-2 text-sm">
              <Link href={`/cohorts/${c.id}`}>{c.name}</Link>
              <span className="num text-ink-faint">
                {c.traineeCount} trainees · {c.timeZone}
              </span>
            </li>
          ))}
        </ul>
      </section>
      <aside className="space-y-8">
        <div>
          <h2 className="mb-3 text-sm font-semibold">New cohort</h2>
          <ActionForm action={createCohort} submitLabel="Create cohort">
            <Field label="Name" name="name" required />
            <SelectField label="Time zone" name="timeZone" defaultValue="Europe/Dublin" options={zones.map((z) => ({ value: z, label: z }))} />
          </ActionForm>
        </div>
        <div>
          <h2 className="mb-3 text-sm font-semibold">Add an instructor to a cohort</h2>
          <ActionForm action={addInstructor} submitLabel="Add instructor">
            <SelectField label="Cohort" name="cohortId" options={cohorts.map((c) => ({ value: c.id, label: c.name }))} />
            <SelectField label="Instructor" name="userId" options={instructors.map((i) => ({ value: i.id, label: i.displayName }))} />
          </ActionForm>
        </div>
      </aside>
    </div>
  );
}
