import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { SectionNotOpen } from "@/components/shell/SectionNotOpen";

export const metadata: Metadata = { title: "Records" };

export default async function RecordsPage() {
  await guardPage();
  return <SectionNotOpen title="Records" description="Tuning records: the hand-over document of a loop's tuning and its proof tests." />;
}
