import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";

export const metadata: Metadata = { title: "Bench" };

export default async function BenchPage() {
  await guardPage();
  return (
    <section className="max-w-2xl">
      <h1 className="mb-2 text-xl font-semibold">Bench</h1>
      <p className="text-sm text-ink-soft">The simulator workspace: a plant, the controller block, the live trend, disturbances, relay and bump tests.</p>
      <p className="mt-4 rounded-sm border border-rule bg-paper-raised px-4 py-3 text-sm text-ink-soft">
        This section is not open yet in this installation.
      </p>
    </section>
  );
}
