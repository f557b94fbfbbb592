import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { guardPage } from "@/app/_lib/guard";
import { benchStartPlant } from "@/app/_lib/bench-start-plant";
import { CommissioningBench } from "@/components/commissioning/CommissioningBench";

export const metadata: Metadata = { title: "Pre-commissioning" };

// The pre-commissioning flow for one stored plant the user may read (own, or shared in the
// organisation); anything else, presets included, is "not found" so private plants are not revealed.
export default async function CommissioningPage({ params }: { params: Promise<{ plantId: string }> }) {
  const user = await guardPage();
  const { plantId } = await params;
  const plant = await benchStartPlant(user, plantId);
  if (!plant) notFound();
  return <CommissioningBench plant={plant} />;
}
