/**
 * Results per scoring window with the automatic feedback (sim/drill/feedback.ts): the attempt's
 * measures beside the reference tuning's, their ratios, the window's score, a verdict, one finding
 * and one hint. Standalone: used on the attempt review and on the trainee's own result page.
 */
import type { AttemptSummary, WindowFeedback } from "@/app/_lib/classroom/contracts";
import { formatElapsed } from "@/components/trend/format";

const VERDICT: Record<WindowFeedback["verdict"], { text: string; cls: string }> = {
  better: { text: "better than the reference", cls: "border-ok text-ok" },
  close: { text: "close to the reference", cls: "border-rule-strong text-ink-soft" },
  worse: { text: "worse than the reference", cls: "border-caution bg-caution-soft text-caution" },
};

const time = (t: number | null) => (t === null ? "never" : `${formatElapsed(t)}`);
const ratio = (r: number) => (Number.isFinite(r) ? `×${r.toFixed(2)}` : "—");

function Measure({ name, measured, reference, r }: { name: string; measured: string; reference: string; r: number }) {
  return (
    <div className="flex items-baseline gap-2">
      <dt className="w-28 shrink-0 text-xs text-ink-faint">{name}</dt>
      <dd className="num text-sm">
        {measured} <span className="text-ink-faint">vs</span> {reference} <span className="text-ink-faint">({ratio(r)})</span>
      </dd>
    </div>
  );
}

/** `kinds`: which windows the drill has; a column without its windows shows a dash. */
export function AttemptSummaryLine({ summary, kinds = { setpoint: true, disturbance: true } }: { summary: AttemptSummary; kinds?: { setpoint: boolean; disturbance: boolean } }) {
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4" data-testid="attempt-summary">
      <div>
        <dt className="text-xs text-ink-faint">Score</dt>
        <dd className="num text-readout">
          {summary.score.toFixed(1)}
          {summary.rawScore !== summary.score ? <span className="ml-2 text-xs text-ink-faint">raw {summary.rawScore.toFixed(1)}</span> : null}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-faint">Settling (longest)</dt>
        <dd className="num">{!kinds.setpoint ? "—" : summary.settlingTimeS === null ? "not settled" : formatElapsed(summary.settlingTimeS)}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-faint">Overshoot (largest)</dt>
        <dd className="num">{summary.overshootC === null ? "—" : `${summary.overshootC.toFixed(2)} °C`}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-faint">Dist. recovery</dt>
        <dd className="num">{!kinds.disturbance ? "—" : summary.recoveryTimeS === null ? "not recovered" : formatElapsed(summary.recoveryTimeS)}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-faint">IAE</dt>
        <dd className="num">{summary.iae.toFixed(0)} °C·s</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-faint">Energy</dt>
        <dd className="num">{summary.energyKWh.toFixed(2)} kWh</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-faint">Cutout trips</dt>
        <dd className={`num ${summary.safetyTrips > 0 ? "text-alarm" : ""}`}>{summary.safetyTrips}</dd>
      </div>
    </dl>
  );
}

export function WindowFeedbackList({ windows, summary }: { windows: WindowFeedback[]; summary?: AttemptSummary }) {
  const totalWeight = windows.reduce((a, w) => a + w.weight, 0) || 1;
  return (
    <section aria-label="Results per window" className="space-y-3" data-testid="window-feedback">
      {summary ? <AttemptSummaryLine summary={summary} kinds={{ setpoint: windows.some((w) => w.kind === "setpoint"), disturbance: windows.some((w) => w.kind === "disturbance") }} /> : null}
      {windows.length === 0 ? <p className="text-sm text-ink-faint">No scoring windows.</p> : null}
      <ol className="divide-y divide-rule border-y border-rule">
        {windows.map((w) => {
          const v = VERDICT[w.verdict];
          const sp = w.kind === "setpoint";
          return (
            <li key={w.windowId} className="space-y-1.5 py-3" data-testid="window-feedback-item">
              <div className="flex flex-wrap items-baseline gap-x-3">
                <h3 className="text-sm font-semibold">{w.label}</h3>
                <span className="text-xs text-ink-faint">
                  {sp ? "setpoint window" : "disturbance window"} · weight <span className="num">{((w.weight / totalWeight) * 100).toFixed(0)} %</span>
                </span>
                <span className="num ml-auto text-sm">
                  score <span className="font-semibold">{w.score.toFixed(1)}</span>
                </span>
                <span className={`rounded-sm border px-1 text-xs ${v.cls}`} data-testid="window-verdict">
                  {v.text}
                </span>
              </div>
              <dl className="space-y-0.5">
                <Measure name="IAE" measured={`${w.measured.iae.toFixed(0)} °C·s`} reference={`${w.reference.iae.toFixed(0)} °C·s`} r={w.ratios.iae} />
                <Measure name={sp ? "Overshoot" : "Peak deviation"} measured={`${w.measured.peak.toFixed(2)} °C`} reference={`${w.reference.peak.toFixed(2)} °C`} r={w.ratios.peak} />
                <Measure name={sp ? "Settling time" : "Recovery time"} measured={time(w.measured.time)} reference={time(w.reference.time)} r={w.ratios.time} />
              </dl>
              <p className="text-sm" data-testid="window-finding">
                {w.finding}
              </p>
              <p className="text-sm text-ink-soft" data-testid="window-hint">
                <span className="text-xs uppercase tracking-wide text-ink-faint">Hint </span>
                {w.hint}
              </p>
            </li>
          );
        })}
      </ol>
      <p className="text-[11px] text-ink-faint">Measured on the true temperature; the reference tuning scores 50 on each window. Ratios are attempt ÷ reference (below 1 is better).</p>
    </section>
  );
}
