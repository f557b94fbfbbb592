"use client";
/**
 * Bump test on the Bench's loop (sim/tuning/bump/bump-test.ts, run by the worker): held in
 * manual at the present OUT, a steady stretch logged, OUT stepped, the response logged and
 * identified (FOPDT and SOPDT by output error). Shows the record with both fitted responses, the
 * fit quality, the identification's warnings and the proposed tunings with Apply.
 */
import { useMemo, useState } from "react";
import type { ControllerConfig } from "@/sim/control/config";
import type { BumpOutcome, BumpTestOptions } from "@/sim/tuning/bump/bump-test";
import type { BlockForm } from "@/sim/tuning/rules/form-conversion";
import type { ControllerType } from "@/sim/tuning/rules/tuning";
import { temperatureDeltaToDisplay } from "@/sim/units";
import { Duration, Qty } from "../plants/format";
import { useBench, type DisplayUnits } from "../store";
import { BumpChart } from "./BumpChart";
import { ProposalView, type ProposalOrigin } from "./ProposalView";

export interface BumpPanelProps {
  units: DisplayUnits;
  spanC: number;
  controllerForm: BlockForm;
  onStart: (options: BumpTestOptions, speed: "bench" | "max") => void;
  onCancel: () => void;
  onApply: (cfg: ControllerConfig, origin?: ProposalOrigin) => void;
}

const PHASES: Record<string, string> = {
  "pre-step": "logging the steady stretch before the step",
  response: "OUT stepped: logging the response",
  returning: "handing the loop back",
  done: "done",
};

export function BumpPanel({ units, spanC, controllerForm, onStart, onCancel, onApply }: BumpPanelProps) {
  const test = useBench((s) => s.test);
  const [step, setStep] = useState("10");
  const [pace, setPace] = useState<"bench" | "max">("bench");
  const [error, setError] = useState<string | null>(null);
  const bump = test?.kind === "bump" ? test : null;
  const running = test?.status === "running";
  const otherRunning = running && test?.kind !== "bump";
  const progress = bump?.progress?.test === "bump" ? bump.progress.progress : null;
  const result = bump?.outcome?.test === "bump" ? bump.outcome : null;

  const start = (e: React.FormEvent) => {
    e.preventDefault();
    const s = Number(step.trim().replace(",", "."));
    if (!Number.isFinite(s) || Math.abs(s) < 1 || Math.abs(s) > 50) return setError("Step size: a number of % between 1 and 50 (negative steps down).");
    setError(null);
    onStart({ stepPercent: s, controller: "PID", form: controllerForm }, pace);
  };

  const select = "rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs";
  return (
    <div className="space-y-3 text-sm" data-testid="bump-panel">
      <form onSubmit={start} aria-label="Bump test settings" className="space-y-1.5 text-xs" noValidate>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="bt-step" className="text-ink-soft">
            OUT step
          </label>
          <span className="flex items-center gap-1">
            <input id="bt-step" inputMode="decimal" value={step} onChange={(e) => setStep(e.target.value)} className="num w-16 rounded-sm border border-rule-strong bg-paper px-1.5 py-0.5 text-right text-xs" />
            <span className="num w-8 text-ink-faint">%</span>
          </span>
        </div>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="bt-pace" className="text-ink-soft">
            Run the test
          </label>
          <select id="bt-pace" value={pace} onChange={(e) => setPace(e.target.value as typeof pace)} className={select}>
            <option value="bench">at the Bench speed</option>
            <option value="max">as fast as possible</option>
          </select>
        </div>
        <p className="text-[11px] text-ink-faint">From steady state: the loop is held in manual at its present OUT, a minute is logged, OUT steps and the response is logged for about six time constants; then the loop is handed back.</p>
        {error ? (
          <p role="alert" className="text-alarm">
            {error}
          </p>
        ) : null}
        {running && bump ? (
          <button type="button" onClick={onCancel} className="w-full rounded-sm border border-rule-strong px-3 py-1.5 text-sm hover:border-ink">
            Cancel the bump test
          </button>
        ) : (
          <button type="submit" disabled={otherRunning} className="w-full rounded-sm bg-ink px-3 py-1.5 text-sm font-semibold text-paper hover:bg-ink-soft disabled:opacity-50">
            Start bump test
          </button>
        )}
        {otherRunning ? <p className="text-ink-faint">A relay test is running; cancel it or wait for it to finish.</p> : null}
      </form>

      {bump && progress && running ? (
        <div className="rounded-sm border border-rule px-2 py-1.5 text-xs" data-testid="bump-progress" aria-live="polite">
          <p className="mb-1 font-semibold">{PHASES[progress.phase] ?? progress.phase}</p>
          <div className="h-1.5 w-full rounded-sm bg-paper-sunk" role="progressbar" aria-label="Bump test progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(progress.fraction * 100)}>
            <div className="h-1.5 rounded-sm bg-ink-soft" style={{ width: `${(progress.fraction * 100).toFixed(1)}%` }} />
          </div>
          <p className="num mt-1 text-ink-faint">
            {(progress.fraction * 100).toFixed(0)} % · {progress.rows} rows logged
          </p>
        </div>
      ) : null}

      {result && !result.outcome.ok ? (
        <div role="status" className="rounded-sm border border-caution/50 bg-caution-soft px-2 py-1.5 text-xs text-caution" data-testid="bump-refusal">
          {"cancelled" in result.outcome ? <p>{result.outcome.message}</p> : <p>No model from this record: {result.outcome.refusal.message}</p>}
        </div>
      ) : null}

      {result && result.outcome.ok ? <BumpResultView outcome={result.outcome} base={result.base} units={units} spanC={spanC} onApply={onApply} initial={{ controller: "PID", form: controllerForm }} /> : null}
      {!bump ? <p className="text-xs text-ink-soft">Settle the loop first: a bump test identifies the process from a step out of steady state.</p> : null}
    </div>
  );
}

type OkOutcome = Extract<BumpOutcome, { ok: true }>;

function BumpResultView({ outcome: o, base, units, spanC, onApply, initial }: { outcome: OkOutcome; base: ControllerConfig; units: DisplayUnits; spanC: number; onApply: (cfg: ControllerConfig, origin?: ProposalOrigin) => void; initial: { rule?: string; controller: ControllerType; form: BlockForm } }) {
  const id = o.identification;
  const [which, setWhich] = useState<"fopdt" | "sopdt">(id.preferred);
  const model = which === "sopdt" && id.sopdt ? id.sopdt.model : id.fopdt.model;
  const T = `°${units.temperature}`;
  const dT = (c: number) => temperatureDeltaToDisplay(c, units.temperature);
  const extraLags = useMemo(() => ({}), []);
  const csv = () => {
    const rows = ["t_s,out_pct,pv_c,fopdt_c,sopdt_c", ...o.record.t.map((t, i) => [t, o.record.out[i], o.record.pv[i], id.fopdt.predicted[i], id.sopdt?.predicted[i] ?? ""].join(","))];
    const url = URL.createObjectURL(new Blob([rows.join("\n") + "\n"], { type: "text/csv" }));
    const a = document.createElement("a");
    a.href = url;
    a.download = "loopwright-bump-test.csv";
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };
  return (
    <div className="space-y-3" data-testid="bump-result">
      <BumpChart t={o.record.t} out={o.record.out} pv={o.record.pv} fopdt={id.fopdt.predicted} sopdt={id.sopdt?.predicted ?? null} stepTimeS={id.step.timeS} unit={units.temperature} />
      <p className="-mt-2 text-right text-[11px]">
        <button type="button" onClick={csv} className="underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
          Export the record (CSV)
        </button>
      </p>
      <div className="text-xs" data-testid="bump-fit">
        <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-faint">
          Fitted models · step {o.stepPercent > 0 ? "+" : ""}
          {o.stepPercent} %
        </h3>
        <ModelFit
          name="FOPDT"
          preferred={id.preferred === "fopdt"}
          gain={dT(id.fopdt.model.gainCPerPercent)}
          unit={T}
          taus={[id.fopdt.model.timeConstantS]}
          theta={id.fopdt.model.deadTimeS}
          r2={id.fopdt.quality.r2}
          nrmse={id.fopdt.quality.nrmse}
          testId="bump-r2"
        />
        {id.sopdt ? (
          <ModelFit
            name="SOPDT"
            preferred={id.preferred === "sopdt"}
            gain={dT(id.sopdt.model.gainCPerPercent)}
            unit={T}
            taus={[id.sopdt.model.timeConstant1S, id.sopdt.model.timeConstant2S]}
            theta={id.sopdt.model.deadTimeS}
            r2={id.sopdt.quality.r2}
            nrmse={id.sopdt.quality.nrmse}
          />
        ) : null}
      </div>
      <p className="text-[11px] text-ink-faint">
        Preferred: {id.preferred === "sopdt" ? "SOPDT (it lowers the squared error by more than 20 %)" : "FOPDT (SOPDT does not lower the squared error by more than 20 %)"}. PV noise σ <Qty value={dT(id.noiseSigmaC)} unit={T} />, residual σ <Qty value={dT(id.residualSigmaC)} unit={T} />, {id.samples.count} rows,
        median interval <Duration seconds={id.samples.medianIntervalS} />.
      </p>
      {id.warnings.length ? (
        <ul className="list-disc space-y-0.5 pl-4 text-xs text-caution" data-testid="bump-warnings">
          {id.warnings.map((w) => (
            <li key={w.code}>{w.message}</li>
          ))}
        </ul>
      ) : null}
      {id.sopdt ? (
        <div className="flex items-center justify-between gap-2 text-xs">
          <label htmlFor="bt-model" className="text-ink-soft">
            Tune from
          </label>
          <select id="bt-model" value={which} onChange={(e) => setWhich(e.target.value as typeof which)} className="rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs">
            <option value="fopdt">FOPDT model</option>
            <option value="sopdt">SOPDT model</option>
          </select>
        </div>
      ) : null}
      <ProposalView key={which} idPrefix="bump" model={model} base={base} initial={initial} sampleTimeAndFilter={o.sampleTimeAndFilter} extraLags={extraLags} units={units} spanC={spanC} onApply={onApply} />
    </div>
  );
}

function ModelFit({ name, preferred, gain, unit, taus, theta, r2, nrmse, testId }: { name: string; preferred: boolean; gain: number; unit: string; taus: number[]; theta: number; r2: number; nrmse: number; testId?: string }) {
  return (
    <div className="mb-1.5 border-l-2 pl-2" style={{ borderColor: preferred ? "var(--color-ink, #1f2326)" : "transparent" }}>
      <p className="font-semibold">
        {name}
        {preferred ? <span className="font-normal text-ink-faint"> · preferred</span> : null}
      </p>
      <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
        <dt className="text-ink-soft">Gain K</dt>
        <dd>
          <Qty value={gain} unit={`${unit}/%`} />
        </dd>
        <dt className="text-ink-soft">{taus.length > 1 ? "Time constants τ1, τ2" : "Time constant τ"}</dt>
        <dd className="num">{taus.map((t) => t.toFixed(t < 10 ? 1 : 0)).join(", ")} s</dd>
        <dt className="text-ink-soft">Dead time θ</dt>
        <dd>
          <Qty value={theta} unit="s" digits={1} />
        </dd>
        <dt className="text-ink-soft">Fit R² · NRMSE</dt>
        <dd className="num">
          <span data-testid={testId}>{r2.toFixed(4)}</span> · {(nrmse * 100).toFixed(2)} %
        </dd>
      </dl>
    </div>
  );
}
