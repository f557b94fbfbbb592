import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";

export const metadata: Metadata = { title: "Twins" };

export default async function TwinsPage() {
  await guardPage();
  return (
    <section className="max-w-2xl">
      <h1 className="mb-2 text-xl font-semibold">Twins</h1>
      <p className="text-sm text-ink-soft">Plants identified from bump-test data logged on real equipment.</p>
      <p className="mt-4 rounded-sm border border-rule bg-paper-raised px-4 py-3 text-sm text-ink-soft">
        This section is not open yet in this installation.
      </p>
    </section>
  );
}
