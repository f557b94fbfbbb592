import type { Metadata } from "next";
import Link from "next/link";
import { guardPage } from "@/app/_lib/guard";
import { NewTwinFlow } from "@/components/twins/NewTwinFlow";
import { acceptTwin } from "../actions";

export const metadata: Metadata = { title: "New twin" };

// Example logs in public/samples (all invented data; see its README).
const EXAMPLES = [
  { file: "dryer-bump-irregular.csv", what: "veneer dryer, irregular sampling, a step ramped by hand" },
  { file: "cabinet-bump-decimal-comma.csv", what: "germination cabinet, decimal commas, date-times, a logger dropout" },
  { file: "oven-bump-fahrenheit.tsv", what: "cure oven, tab-separated, °F, SP and mode columns" },
  { file: "broken-non-numeric.csv", what: "refused: a non-numeric reading" },
  { file: "broken-no-step.csv", what: "refused: no step in OUT" },
];

export default async function NewTwinPage() {
  await guardPage();
  return (
    <section className="space-y-5">
      <div>
        <p className="text-sm">
          <Link href="/twins" className="text-ink-soft underline decoration-rule-strong hover:text-ink">
            Twins
          </Link>
        </p>
        <h1 className="mb-1 text-xl font-semibold">New twin</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          Upload a bump test logged on the equipment: OUT stepped by hand in manual from a steady state, PV logged until it settles. Map the columns, check the
          plot, identify FOPDT and SOPDT models and accept the one that fits. Nothing is saved until you accept; the server then reads the file again and
          repeats the identification itself.
        </p>
      </div>
      <details className="text-sm text-ink-soft">
        <summary className="cursor-pointer">Example logs (invented data)</summary>
        <ul className="mt-2 space-y-1">
          {EXAMPLES.map((e) => (
            <li key={e.file}>
              <a href={`/samples/${e.file}`} download className="underline decoration-rule-strong hover:text-ink">
                {e.file}
              </a>{" "}
              — {e.what}
            </li>
          ))}
        </ul>
      </details>
      <NewTwinFlow action={acceptTwin} />
    </section>
  );
}
