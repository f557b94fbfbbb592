import type { ProofTestStored } from "@/app/_lib/records/record-document";
import { PROOF_COLUMNS, proofFacts, proofRows } from "@/app/_lib/records/record-figures";
import { TableHead } from "@/components/tables/TableHead";
import { FigureList } from "./FigureList";
import { TrendSvg } from "./TrendSvg";

/** One proof test: what ran, its results per window as the server's re-run measured them, its trend. */
export function ProofTestSection({ test, index }: { test: ProofTestStored; index: number }) {
  return (
    <section className="record-proof-test space-y-3 print:break-before-page" aria-labelledby={`proof-${index}`}>
      <h3 id={`proof-${index}`} className="text-base font-semibold">
        Proof test {index + 1}: {test.label}
      </h3>
      <FigureList figures={proofFacts(test)} />
      <p className="text-xs text-ink-faint">Measured by the server&apos;s re-run, on the simulated air temperature (what the drills score).</p>
      <table className="w-full max-w-3xl text-sm">
        <TableHead columns={[...PROOF_COLUMNS]} />
        <tbody>
          {proofRows(test).map((r, i) => (
            <tr key={i} className="border-b border-rule">
              {r.map((c, j) => (
                <td key={j} className={`py-1.5 pr-3 ${j ? "num" : ""}`}>
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <TrendSvg rows={test.trend} title={test.label} />
    </section>
  );
}
