"use client";
import { TableHead } from "@/components/tables/TableHead";
import { formatElapsed } from "@/components/trend/format";
import type { VariantRun } from "@/sim/experiments/variants";

const time = (s: number | null) => (s == null ? "—" : formatElapsed(s));
const c2 = (v: number | null) => (v == null ? "—" : `${v.toFixed(2)} °C`);

/** The experiment's runs side by side: one row per variant, per scoring window. */
export function ExperimentTable({ rows, onLoad }: { rows: VariantRun[]; onLoad?: (run: VariantRun) => void }) {
  if (rows.length === 0) return null;
  return (
    <table className="w-full border-collapse text-sm" data-testid="experiment-table">
      <TableHead columns={["run", "window", "rise", "overshoot", "settling", "IAE °C·s", "peak dev.", "recovery", ""]} />
      <tbody className="num">
        {rows.flatMap((r) =>
          r.results.windows.map((w, wi) => {
            const t = w.trueTemperature;
            return (
              <tr key={`${r.index}-${w.id}`} className="border-b border-rule" data-testid={wi === 0 ? "experiment-row" : undefined}>
                <td className="py-1.5 font-sans">{wi === 0 ? r.label : ""}</td>
                <td className="font-sans text-ink-soft">{w.label}</td>
                <td>{time(t.riseTimeS)}</td>
                <td>{t.overshootPct == null ? "—" : `${t.overshootPct.toFixed(1)} %`}</td>
                <td>{time(t.settlingTimeS)}</td>
                <td data-testid={wi === 0 ? "experiment-iae" : undefined}>{t.iae.toFixed(1)}</td>
                <td>{c2(t.peakDeviationC)}</td>
                <td>{time(t.recoveryTimeS)}</td>
                <td className="text-right font-sans">
                  {wi === 0 && onLoad ? (
                    <button type="button" onClick={() => onLoad(r)} className="text-xs underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
                      load tuning
                    </button>
                  ) : null}
                </td>
              </tr>
            );
          }),
        )}
      </tbody>
    </table>
  );
}
