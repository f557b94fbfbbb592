"use client";
/**
 * The mapping step of a new twin: the form, the file read again on every change, and what came of
 * it — the refusal in words beside the form (nothing is saved at this stage), or the first rows as
 * a table, the sampling facts and a plot of the mapped columns.
 */
import { useEffect, useMemo, useState } from "react";
import type { LogMapping, LogTable } from "@/sim/import";
import { TableHead } from "@/components/tables/TableHead";
import { logSeries } from "./fit-series";
import { readWithMapping, type LogReading } from "./log-reading";
import { LogPreviewChart } from "./LogPreviewChart";
import { columnName, MappingForm } from "./MappingForm";
import { SamplingFacts } from "./SamplingFacts";

const PREVIEW_ROWS = 8;

function roleOf(mapping: LogMapping, i: number): string | null {
  const c = mapping.columns;
  if (c.time === i) return "time";
  if (c.out === i) return "OUT";
  if (c.pv === i) return "PV";
  if (c.sp === i) return "SP";
  if (c.mode === i) return "mode";
  return null;
}

function PreviewTable({ table, mapping }: { table: LogTable; mapping: LogMapping }) {
  const cols = Array.from({ length: table.columnCount }, (_, i) => i);
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm" data-testid="log-preview-table">
        <TableHead columns={["line", ...cols.map((i) => columnName(table, i))]} />
        <tbody>
          <tr className="border-b border-rule text-xs text-ink-faint">
            <td className="py-1">read as</td>
            {cols.map((i) => (
              <td key={i} className="py-1 font-medium text-ink-soft">
                {roleOf(mapping, i) ?? "—"}
              </td>
            ))}
          </tr>
          {table.rows.slice(0, PREVIEW_ROWS).map((row, r) => (
            <tr key={r} className="border-b border-rule">
              <td className="num py-1 text-ink-faint">{table.lineNumbers[r]}</td>
              {cols.map((i) => (
                <td key={i} className={`num py-1 ${roleOf(mapping, i) ? "text-ink" : "text-ink-faint"}`}>
                  {row[i] ?? ""}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-faint">
        First {Math.min(PREVIEW_ROWS, table.rows.length)} of {table.rows.length.toLocaleString("en-GB")} rows as written in the file.
      </p>
    </div>
  );
}

export function MappingStep({
  text,
  byteSize,
  fileName,
  initialMapping,
  onReading,
}: {
  text: string;
  byteSize: number;
  fileName: string;
  initialMapping: LogMapping;
  onReading?: (mapping: LogMapping, reading: LogReading) => void;
}) {
  const [mapping, setMapping] = useState(initialMapping);
  const reading = useMemo(() => readWithMapping(text, byteSize, mapping), [text, byteSize, mapping]);
  const series = useMemo(() => (reading.result.ok ? logSeries(reading.result.log) : null), [reading]);
  useEffect(() => onReading?.(mapping, reading), [mapping, reading, onReading]);
  return (
    <section className="space-y-4" aria-label="Read the log">
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <MappingForm mapping={mapping} table={reading.table} onChange={setMapping} />
        <div aria-live="polite">
          {reading.refusal ? (
            <p role="alert" data-testid="mapping-refusal" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-sm text-alarm">
              {reading.refusal}
              <span className="mt-1 block text-xs text-ink-soft">Nothing has been saved. Change the settings on the left or choose another file.</span>
            </p>
          ) : (
            <p role="status" data-testid="mapping-ok" className="rounded-sm border border-ok/40 bg-paper-raised px-3 py-2 text-sm text-ok">
              The log reads with these settings. Check the plot, then identify.
            </p>
          )}
        </div>
      </div>
      {reading.table ? <PreviewTable table={reading.table} mapping={mapping} /> : null}
      {reading.result.ok && series ? (
        <>
          <LogPreviewChart series={series} fileName={fileName.replace(/\.[^.]*$/, "")} />
          <SamplingFacts facts={reading.result.summary} />
        </>
      ) : null}
    </section>
  );
}
