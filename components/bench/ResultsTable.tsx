"use client";
import type { TemperatureUnit } from "@/sim/units";
import { temperatureDeltaToDisplay } from "@/sim/units";
import { formatElapsed } from "@/components/trend/format";
import { TableHead } from "@/components/tables/TableHead";
import type { BenchWindow } from "./bench-results";

const time = (s: number | null) => (s == null ? "—" : formatElapsed(s));

export function ResultsTable({ windows, unit }: { windows: BenchWindow[]; unit: TemperatureUnit }) {
  const dT = (c: number | null, digits = 2) => (c == null ? "—" : `${temperatureDeltaToDisplay(c, unit).toFixed(digits)} °${unit}`);
  return (
    <section aria-label="Results" className="rounded-sm border border-rule bg-paper-raised p-4">
      <h2 className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-faint">Results · on the true temperature</h2>
      {windows.length === 0 ? (
        <p className="text-sm text-ink-faint">Change the SP or apply a disturbance: each one gets a row here.</p>
      ) : (
        <table className="w-full border-collapse text-sm" data-testid="results-table">
          <TableHead columns={["window", "rise 10–90 %", "overshoot", "settling", "IAE", "peak dev.", "recovery"]} />
          <tbody className="num">
            {windows.map((w, i) => (
              <tr key={`${w.label}-${i}`} className="border-b border-rule">
                <td className="py-1.5 font-sans">{w.label}</td>
                <td>{time(w.results.riseTimeS)}</td>
                <td>{w.results.overshootPct == null ? "—" : `${dT(w.results.overshootC, 2)} (${w.results.overshootPct.toFixed(1)} %)`}</td>
                <td>{time(w.results.settlingTimeS)}</td>
                <td>{`${temperatureDeltaToDisplay(w.results.iae, unit).toFixed(0)} °${unit}·s`}</td>
                <td>{dT(w.results.peakDeviationC)}</td>
                <td>{time(w.results.recoveryTimeS)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <p className="mt-2 text-[11px] text-ink-faint">Settling: last exit from ± max(2 % of the step, 0.5 °C, 3σ of the PV noise).</p>
    </section>
  );
}
