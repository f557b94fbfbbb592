import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { SectionNotOpen } from "@/components/shell/SectionNotOpen";

export const metadata: Metadata = { title: "Bench" };

export default async function BenchPage() {
  await guardPage();
  return <SectionNotOpen title="Bench" description="The simulator workspace: a plant, the controller block, the live trend, disturbances, relay and bump tests." />;
}
