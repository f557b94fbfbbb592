import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { recordsFor } from "@/app/_lib/records/record-queries";
import { RecordList } from "@/components/records/RecordList";

export const metadata: Metadata = { title: "Records" };

const one = (v: string | string[] | undefined) => (typeof v === "string" && v.length <= 200 ? v : null);

export default async function RecordsPage({ searchParams }: { searchParams: Promise<{ plant?: string | string[]; author?: string | string[] }> }) {
  const user = await guardPage();
  const q = await searchParams;
  const filter = { plantRef: one(q.plant), ownerId: one(q.author) };
  const data = await recordsFor(user, filter);
  return (
    <section className="space-y-4">
      <div>
        <h1 className="mb-1 text-xl font-semibold">Records</h1>
        <p className="text-sm text-ink-soft">Tuning records of your organisation: the hand-over document of a loop&apos;s tuning and its proof tests.</p>
      </div>
      <RecordList data={data} filter={filter} />
    </section>
  );
}
