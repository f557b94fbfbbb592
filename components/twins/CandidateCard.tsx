"use client";
/** One identified model: its parameters with units, its fit quality, and its fit and residual plot. */
import { useMemo } from "react";
import type { CandidateRecord } from "@/app/_lib/twins/identification-record";
import { FitChart } from "./FitChart";
import type { FitSeries } from "./fit-series";
import { celsiusText, gainText, kindLabel, percentText, r2Text, seconds } from "./model-format";

function Row({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="flex justify-between gap-3 border-b border-rule py-1">
      <dt className="text-ink-soft">{term}</dt>
      <dd className="num text-right">{children}</dd>
    </div>
  );
}

export function CandidateCard({
  candidate,
  preferred,
  chosen,
  series,
  fileName,
}: {
  candidate: CandidateRecord;
  preferred: boolean;
  chosen?: boolean;
  series: FitSeries | null;
  fileName: string;
}) {
  const label = kindLabel(candidate.kind);
  const taus = candidate.timeConstantsS;
  const tags = useMemo(() => [preferred ? "better fit" : null, chosen ? "in use" : null].filter(Boolean).join(" · "), [preferred, chosen]);
  return (
    <article className="min-w-0 space-y-2 rounded-sm border border-rule bg-paper-raised p-3" data-testid={`candidate-${candidate.kind}`}>
      <header className="flex items-baseline justify-between gap-2">
        <h3 className="text-sm font-semibold">{label}</h3>
        {tags ? <span className="text-xs text-ink-faint">{tags}</span> : null}
      </header>
      <p className="text-xs text-ink-faint">{candidate.kind === "fopdt" ? "K·e^(−θs) / (τs + 1)" : "K·e^(−θs) / ((τ1 s + 1)(τ2 s + 1))"}</p>
      <dl className="text-sm">
        <Row term="Gain K">{gainText(candidate.gainCPerPercent)}</Row>
        {taus.length === 1 ? (
          <Row term="Time constant τ">{seconds(taus[0])}</Row>
        ) : (
          <>
            <Row term="Time constant τ1">{seconds(taus[0])}</Row>
            <Row term="Time constant τ2">{seconds(taus[1])}</Row>
          </>
        )}
        <Row term="Dead time θ">{seconds(candidate.deadTimeS)}</Row>
        <Row term="R²">{r2Text(candidate.quality.r2)}</Row>
        <Row term="NRMSE (of PV range)">{percentText(candidate.quality.nrmse)}</Row>
        <Row term="Residual σ">{celsiusText(candidate.quality.rmseC)}</Row>
      </dl>
      {series ? <FitChart series={series} label={label} fileName={`${fileName}-${candidate.kind}`} /> : null}
    </article>
  );
}
