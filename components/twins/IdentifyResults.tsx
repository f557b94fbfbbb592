"use client";
/** The identification's outcome: both candidates side by side, what the data say about noise and resolution, and the warnings. */
import { useMemo } from "react";
import { candidateRecord } from "@/app/_lib/twins/identification-record";
import type { MappedLog, LogSummary } from "@/sim/import";
import type { Identification } from "@/sim/tuning/identify";
import { CandidateCard } from "./CandidateCard";
import { fitSeries } from "./fit-series";
import { celsiusText } from "./model-format";
import { Warnings } from "./Warnings";

export function IdentifyResults({ identification, summary, log, fitNote, fileName }: { identification: Identification; summary: LogSummary; log: MappedLog; fitNote: string | null; fileName: string }) {
  const fo = useMemo(() => candidateRecord(identification.fopdt), [identification]);
  const so = useMemo(() => (identification.sopdt ? candidateRecord(identification.sopdt) : null), [identification]);
  const foSeries = useMemo(() => fitSeries(log.t, log.pv, identification.fopdt.predicted), [log, identification]);
  const soSeries = useMemo(() => (identification.sopdt ? fitSeries(log.t, log.pv, identification.sopdt.predicted) : null), [log, identification]);
  const warnings = [...identification.warnings, ...(fitNote ? [{ code: "fitted-on-block-means", message: fitNote }] : [])];
  return (
    <section className="space-y-3" aria-label="Candidates" data-testid="identify-results">
      <div className="grid gap-3 md:grid-cols-2">
        <CandidateCard candidate={fo} preferred={identification.preferred === "fopdt"} series={foSeries} fileName={fileName} />
        {so ? (
          <CandidateCard candidate={so} preferred={identification.preferred === "sopdt"} series={soSeries} fileName={fileName} />
        ) : (
          <p className="rounded-sm border border-rule bg-paper-raised p-3 text-sm text-ink-soft">No SOPDT fit was made for this log.</p>
        )}
      </div>
      <p className="text-sm text-ink-soft">
        From the data: PV noise σ <span className="num text-ink">{celsiusText(identification.noiseSigmaC)}</span> (from second differences, model-free); PV
        resolution step <span className="num text-ink">{summary.quantizationStepC == null ? "none found (continuous)" : celsiusText(summary.quantizationStepC)}</span>.
        The better fit is marked; SOPDT counts as better when it lowers the squared error by more than 20 %.
      </p>
      <Warnings warnings={warnings} />
    </section>
  );
}
