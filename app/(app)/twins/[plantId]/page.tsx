import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";
import { guardPage } from "@/app/_lib/guard";
import { twinDetail } from "@/app/_lib/twins/twin-queries";
import { kindLabel, modelSummary, byteSizeText, celsiusText, sig3 } from "@/components/twins/model-format";
import { ReproducedCheck } from "@/components/twins/ReproducedCheck";
import { SamplingFacts, type SamplingFactsData } from "@/components/twins/SamplingFacts";
import { ShareTwinForm } from "@/components/twins/ShareTwinForm";
import { TwinLinks } from "@/components/twins/TwinLinks";
import { Warnings } from "@/components/twins/Warnings";
import { setTwinShared } from "../actions";

export const metadata: Metadata = { title: "Twin" };

const dateTime = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

function Fact({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="flex justify-between gap-3 border-b border-rule py-1">
      <dt className="text-ink-soft">{term}</dt>
      <dd className="num min-w-0 text-right">{children}</dd>
    </div>
  );
}

/** The upload's stored summary as the sampling facts read it (lenient: an older summary shows what it has). */
function factsOf(summary: Record<string, unknown>): SamplingFactsData | null {
  const n = (k: string) => (typeof summary[k] === "number" ? (summary[k] as number) : null);
  const rows = n("rows");
  if (rows === null) return null;
  return {
    rows,
    spanS: n("spanS") ?? NaN,
    medianIntervalS: n("medianIntervalS") ?? NaN,
    irregular: summary.irregular === true,
    gaps: Array.isArray(summary.gaps) ? (summary.gaps as { atS: number; lengthS: number }[]) : 0,
    noiseSigmaC: n("noiseSigmaC"),
    quantizationStepC: n("quantizationStepC"),
    step: (summary.step as SamplingFactsData["step"]) ?? null,
    encoding: typeof summary.encoding === "string" ? summary.encoding : null,
  };
}

export default async function TwinPage({ params }: { params: Promise<{ plantId: string }> }) {
  const { plantId } = await params;
  const user = await guardPage();
  const twin = await twinDetail(user, plantId);
  if (!twin) notFound();
  const id = twin.identification;
  const def = twin.definition;
  const facts = factsOf(twin.upload.summary);
  const columns = (twin.upload.summary.columns ?? null) as Record<string, string | null> | null;
  const mapping = twin.mapping as { timeFormat?: string; decimalMark?: string; temperatureUnit?: string };
  const base = twin.upload.fileName.replace(/\.[^.]*$/, "");
  return (
    <article className="space-y-6">
      <header className="space-y-1">
        <p className="text-sm">
          <Link href="/twins" className="text-ink-soft underline decoration-rule-strong hover:text-ink">
            Twins
          </Link>
        </p>
        <h1 className="text-xl font-semibold">{twin.name}</h1>
        {twin.description ? <p className="max-w-3xl text-sm text-ink-soft">{twin.description}</p> : null}
        <p className="text-sm text-ink-soft">
          {twin.mine ? "Yours" : `Shared by ${twin.ownerName}`} · {twin.shared ? "shared within the organisation" : "private"}
        </p>
        <TwinLinks plantId={twin.id} />
      </header>

      <div className="grid gap-6 lg:grid-cols-2">
        <section className="space-y-2" aria-label="Model in use">
          <h2 className="text-base font-semibold">Model in use</h2>
          {id && twin.chosen ? (
            <p className="num text-sm">
              <span className="text-ink-soft">{kindLabel(twin.chosen.kind)}</span> {modelSummary(twin.chosen)}
            </p>
          ) : (
            <p className="text-sm text-caution">The identification record of this twin cannot be read.</p>
          )}
          {def ? (
            <dl className="text-sm">
              <Fact term="Operating point (before the step)">
                OUT {sig3(def.operatingPoint.outPercent)} %, PV {celsiusText(def.operatingPoint.temperatureC)}
              </Fact>
              <Fact term="Ambient">
                {celsiusText(def.ambientC)} {id?.ambient?.source === "pv-before-step" ? "(none given: PV before the step)" : id?.ambient ? "(given)" : ""}
              </Fact>
              <Fact term="Heater rating">{sig3(def.heaterRatingW)} W (not in the log: energy figures only)</Fact>
              <Fact term="PV noise σ (from the data)">{celsiusText(id?.noiseSigmaC ?? null)}</Fact>
              <Fact term="PV resolution step">{id?.quantizationStepC == null ? "continuous" : celsiusText(id.quantizationStepC)}</Fact>
            </dl>
          ) : null}
          {twin.mine ? <ShareTwinForm plantId={twin.id} shared={twin.shared} action={setTwinShared} /> : null}
        </section>

        <section className="space-y-2" aria-label="Source file">
          <h2 className="text-base font-semibold">Source file</h2>
          <dl className="text-sm">
            <Fact term="File">{twin.upload.fileName}</Fact>
            <Fact term="Size">{byteSizeText(twin.upload.byteSize)}</Fact>
            <Fact term="SHA-256">
              <span className="break-all text-xs" data-testid="upload-sha256">
                {twin.upload.sha256}
              </span>
            </Fact>
            <Fact term="Uploaded">
              {dateTime.format(new Date(twin.upload.uploadedAt))} UTC by {twin.upload.uploadedBy}
            </Fact>
            {columns ? (
              <Fact term="Columns read">
                time “{columns.time}”, OUT “{columns.out}”, PV “{columns.pv}”{columns.sp ? `, SP “${columns.sp}”` : ""}
                {columns.mode ? `, mode “${columns.mode}”` : ""}
              </Fact>
            ) : null}
            <Fact term="Read as">
              time in {mapping.timeFormat === "timestamp" ? "date-times" : "seconds"}, decimal {mapping.decimalMark === "," ? "comma" : "point"}, °{mapping.temperatureUnit ?? "C"}
            </Fact>
          </dl>
          <a href={`/api/uploads/${twin.upload.id}`} className="inline-block text-sm underline decoration-rule-strong hover:text-ink" data-testid="upload-download">
            Download the original file
          </a>
          {facts ? <SamplingFacts facts={facts} /> : null}
        </section>
      </div>

      <section className="space-y-3" aria-label="Candidates">
        <h2 className="text-base font-semibold">Candidates and fit</h2>
        <Suspense fallback={<p className="text-sm text-ink-soft">Re-running the identification from the original file…</p>}>
          <ReproducedCheck user={user} plantId={twin.id} stored={id} fileName={base} />
        </Suspense>
        {id ? <Warnings warnings={id.warnings} /> : null}
      </section>
    </article>
  );
}
