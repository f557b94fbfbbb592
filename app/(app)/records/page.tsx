import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";

export const metadata: Metadata = { title: "Records" };

export default async function RecordsPage() {
  await guardPage();
  return (
    <section className="max-w-2xl">
      <h1 className="mb-2 text-xl font-semibold">Records</h1>
      <p className="text-sm text-ink-soft">Tuning records: the hand-over document of a loop's tuning and its proof tests.</p>
      <p className="mt-4 rounded-sm border border-rule bg-paper-raised px-4 py-3 text-sm text-ink-soft">
        This section is not open yet in this installation.
      </p>
    </section>
  );
}
