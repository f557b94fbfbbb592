import type { Metadata } from "next";
import Link from "next/link";
import { guardPage } from "@/app/_lib/guard";
import { twinsFor } from "@/app/_lib/twins/twin-queries";
import { TwinList } from "@/components/twins/TwinList";

export const metadata: Metadata = { title: "Twins" };

export default async function TwinsPage() {
  const user = await guardPage();
  const twins = await twinsFor(user);
  return (
    <section className="space-y-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="mb-1 text-xl font-semibold">Twins</h1>
          <p className="max-w-2xl text-sm text-ink-soft">
            Plants identified from a bump test logged on the real equipment. A twin runs on the Bench and in drills like any plant; its original log is kept
            unchanged, so the identification can always be redone from it.
          </p>
        </div>
        <Link href="/twins/new" className="rounded-sm bg-ink px-4 py-2 text-sm font-medium text-paper hover:bg-ink-soft">
          New twin
        </Link>
      </div>
      <TwinList twins={twins} />
    </section>
  );
}
