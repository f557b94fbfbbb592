import type { Metadata } from "next";
import Link from "next/link";
import { guardPage } from "@/app/_lib/guard";
import { cohortsFor } from "@/db/queries";

export const metadata: Metadata = { title: "Cohorts" };

export default async function CohortsPage() {
  const user = await guardPage();
  const list = await cohortsFor(user);
  return (
    <section>
      <h1 className="mb-6 text-xl font-semibold">Cohorts</h1>
      {list.length === 0 ? <p className="text-sm text-ink-soft">You are not in any cohort yet.</p> : null}
      <ul className="divide-y divide-rule border-y border-rule">
        {list.map((c) => (
          <li key={c.id} className="flex items-baseline justify-between py-3 text-sm">
            {c.myRole === "trainee" ? <span>{c.name}</span> : <Link href={`/cohorts/${c.id}`}>{c.name}</Link>}
            <span className="num text-ink-faint">
              {c.traineeCount} trainees · {c.timeZone} · you: {c.myRole}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
