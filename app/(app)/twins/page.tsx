import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { SectionNotOpen } from "@/components/shell/SectionNotOpen";

export const metadata: Metadata = { title: "Twins" };

export default async function TwinsPage() {
  await guardPage();
  return <SectionNotOpen title="Twins" description="Plants identified from bump-test data logged on real equipment." />;
}
