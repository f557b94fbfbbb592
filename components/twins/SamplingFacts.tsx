/** What the data say before any model: rows, span, sampling (irregular, gaps), noise, resolution, the step. */
import { formatElapsed } from "@/components/trend/format";
import { celsiusText, seconds, sig3 } from "./model-format";

export interface SamplingFactsData {
  rows: number;
  spanS: number;
  medianIntervalS: number;
  irregular: boolean;
  gaps: { atS: number; lengthS: number }[] | number;
  noiseSigmaC: number | null;
  quantizationStepC: number | null;
  step?: { timeS: number; outBeforePercent: number; outAfterPercent: number } | null;
  encoding?: string | null;
}

function Fact({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="flex justify-between gap-3 border-b border-rule py-1">
      <dt className="text-ink-soft">{term}</dt>
      <dd className="num text-right">{children}</dd>
    </div>
  );
}

export function SamplingFacts({ facts }: { facts: SamplingFactsData }) {
  const gaps = typeof facts.gaps === "number" ? null : facts.gaps;
  const gapCount = typeof facts.gaps === "number" ? facts.gaps : facts.gaps.length;
  return (
    <dl className="grid grid-cols-1 gap-x-6 text-sm sm:grid-cols-2" data-testid="sampling-facts">
      <Fact term="Rows">{facts.rows.toLocaleString("en-GB")}</Fact>
      <Fact term="Span">{seconds(facts.spanS)}</Fact>
      <Fact term="Sample interval (median)">{seconds(facts.medianIntervalS)}</Fact>
      <Fact term="Sampling">{facts.irregular ? "irregular (intervals vary by over 10 %)" : "regular"}</Fact>
      <Fact term="Gaps (over 5 intervals)">
        {gapCount === 0 ? "none" : `${gapCount}${gaps ? ` — first at ${formatElapsed(gaps[0].atS)}, ${sig3(gaps[0].lengthS)} s long` : ""}`}
      </Fact>
      <Fact term="PV noise σ">{celsiusText(facts.noiseSigmaC)}</Fact>
      <Fact term="PV resolution step">{facts.quantizationStepC == null ? "continuous" : celsiusText(facts.quantizationStepC)}</Fact>
      {facts.step ? (
        <Fact term="OUT step">
          {sig3(facts.step.outBeforePercent)} → {sig3(facts.step.outAfterPercent)} % at {formatElapsed(facts.step.timeS)}
        </Fact>
      ) : null}
      {facts.encoding ? <Fact term="Text encoding">{facts.encoding}</Fact> : null}
    </dl>
  );
}
