import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";

export const metadata: Metadata = { title: "Drills" };

export default async function DrillsPage() {
  await guardPage();
  return (
    <section className="max-w-2xl">
      <h1 className="mb-2 text-xl font-semibold">Drills</h1>
      <p className="text-sm text-ink-soft">Instructors build disturbance drills here and assign them to cohorts; trainees find their attempts.</p>
      <p className="mt-4 rounded-sm border border-rule bg-paper-raised px-4 py-3 text-sm text-ink-soft">
        This section is not open yet in this installation.
      </p>
    </section>
  );
}
