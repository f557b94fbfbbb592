import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { SectionNotOpen } from "@/components/shell/SectionNotOpen";

export const metadata: Metadata = { title: "Drills" };

export default async function DrillsPage() {
  await guardPage();
  return <SectionNotOpen title="Drills" description="Instructors build disturbance drills here and assign them to cohorts; trainees find their attempts." />;
}
