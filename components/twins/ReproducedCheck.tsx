/**
 * The detail page's check that the twin still follows from its file: the stored bytes hash to the
 * stored SHA-256 and a fresh identification from them gives the stored candidates. Rendered on the
 * server inside a Suspense boundary (the fit takes a second or two), with the fresh fits plotted.
 */
import type { StoredIdentification } from "@/app/_lib/twins/identification-record";
import { reidentify } from "@/app/_lib/twins/twin-queries";
import type { BenchUser } from "@/app/_lib/bench-store";
import { CandidateCard } from "./CandidateCard";
import { fitSeries } from "./fit-series";

export async function ReproducedCheck({ user, plantId, stored, fileName }: { user: BenchUser; plantId: string; stored: StoredIdentification | null; fileName: string }) {
  const check = await reidentify(user, plantId);
  if (!check) return null;
  const fresh = check.result?.ok ? check.result : null;
  const verdict = check.reproduced ? (
    <p role="status" data-testid="reproduced" className="rounded-sm border border-ok/40 bg-paper-raised px-3 py-2 text-sm text-ok">
      Identification reproduced from the original file: the SHA-256 matches and a fresh fit gives the stored candidates.
    </p>
  ) : (
    <div role="alert" data-testid="not-reproduced" className="rounded-sm border border-caution/40 bg-caution-soft px-3 py-2 text-sm text-caution">
      {!check.checksumMatches ? <p>The stored file no longer matches its SHA-256.</p> : null}
      {check.differences.length ? <p>A fresh identification from the original file differs: {check.differences.join("; ")}.</p> : null}
      {check.storedEngineVersion && check.storedEngineVersion !== check.engineVersion ? (
        <p>
          It was identified with engine {check.storedEngineVersion}; this is engine {check.engineVersion}.
        </p>
      ) : null}
    </div>
  );
  return (
    <div className="space-y-3">
      {verdict}
      {stored ? (
        <div className="grid gap-3 md:grid-cols-2">
          {(["fopdt", "sopdt"] as const).map((k) => {
            const c = stored.candidates[k];
            if (!c) return <p key={k} className="rounded-sm border border-rule bg-paper-raised p-3 text-sm text-ink-soft">No SOPDT fit was stored for this twin.</p>;
            const fit = fresh ? (k === "fopdt" ? fresh.identification.fopdt : fresh.identification.sopdt) : null;
            const series = fresh && fit ? fitSeries(fresh.log.t, fresh.log.pv, fit.predicted) : null;
            return (
              <CandidateCard
                key={k}
                candidate={{ kind: c.kind, gainCPerPercent: c.gainCPerPercent, timeConstantsS: c.timeConstantsS, deadTimeS: c.deadTimeS, baselineC: c.baselineC ?? NaN, quality: c.quality }}
                preferred={stored.preferred === k}
                chosen={stored.chosen === k}
                series={series}
                fileName={fileName}
              />
            );
          })}
        </div>
      ) : null}
    </div>
  );
}
