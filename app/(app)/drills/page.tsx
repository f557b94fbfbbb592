import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { DrillList } from "@/components/drills/DrillList";
import { DRILL_STARTERS } from "@/components/drills/starters";
import { drillsFor, isDrillBuilder } from "@/db/drill-queries";
import { createDrill } from "./actions";

export const metadata: Metadata = { title: "Drills" };

export default async function DrillsPage() {
  const user = await guardPage();
  if (!isDrillBuilder(user)) {
    return (
      <section className="max-w-2xl">
        <h1 className="mb-2 text-xl font-semibold">Drills</h1>
        <p className="text-sm text-ink-soft">Drills your instructors assign to your cohort appear on your dashboard, with their due dates and the attempts you have left.</p>
      </section>
    );
  }
  return (
    <section>
      <h1 className="mb-1 text-xl font-semibold">Drills</h1>
      <p className="mb-5 text-sm text-ink-soft">Scenarios for your cohorts: a plant, a timeline of SP changes and disturbances, and how attempts are scored. Publishing freezes a version.</p>
      <DrillList initial={await drillsFor(user)} starters={DRILL_STARTERS} createDrill={createDrill} />
    </section>
  );
}
