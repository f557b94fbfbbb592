"use client";
/**
 * Experiments on the Bench's plant: a sweep of one parameter, PI against PID, and a Kc × Ti
 * tuning map. All run in their own worker on the same proof test and seed, with progress and
 * cancel; results appear in the middle column.
 */
import { useEffect, useMemo, useState, type ReactNode } from "react";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import { jobsFor, type RunJob, type Variant } from "@/sim/experiments/variants";
import type { DrillInput } from "@/sim/drill/schema";
import { experimentDrill, type ProofTest } from "@/sim/experiments/experiment-drill";
import { parseValueList, piVersusPidVariants, SWEEP_PARAMETERS, sweepVariants, type SweepParameter } from "@/sim/experiments/sweep";
import { geometricAxis, MAP_METRICS, mapVariants, type MapMetric } from "@/sim/experiments/tuning-map";
import type { ExperimentState } from "./use-experiments";
import { useBench } from "../store";
import { RULE_LABELS } from "../tests/labels";
import { comparePair } from "./compare-suggestion";

type Start = (kind: ExperimentState["kind"], jobs: RunJob[], meta?: ExperimentState["meta"]) => void;

export interface ExperimentsPanelProps {
  baseDrill: DrillInput;
  controller: ControllerConfig;
  seed: number;
  state: ExperimentState;
  start: Start;
  cancel: () => void;
  /** an editor of a site proof test (setpoint ladder, disturbances, stored drill) offered beside the SP step; it puts its test in the store's siteProof */
  siteProofEditor?: ReactNode;
}

export function ExperimentsPanel({ baseDrill, controller, seed, state, start, cancel, siteProofEditor }: ExperimentsPanelProps) {
  const [tab, setTab] = useState<"sweep" | "compare" | "map">("sweep");
  const [source, setSource] = useState<"step" | "site">(siteProofEditor ? "site" : "step");
  const siteProof = useBench((s) => s.siteProof);
  // the rule last applied, asked again for PI and for PID: the pair worth comparing
  const findings = useBench((s) => s.findings);
  const suggested = useMemo(() => comparePair(findings, controller), [findings, controller]);
  const suggestionKey = suggested ? JSON.stringify(suggested) : null;
  useEffect(() => {
    if (!suggested) return;
    setPid({ kc: String(suggested.pid.kc), ti: String(suggested.pid.ti), td: String(suggested.pid.td) });
    setPi({ kc: String(suggested.pi.kc), ti: String(suggested.pi.ti) });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [suggestionKey]);
  const focus = useBench((s) => s.focus);
  // the hand-over path's "proof tests" stage opens the comparison on the site proof test
  useEffect(() => {
    if (focus?.panel !== "proof") return;
    setTab("compare");
    if (siteProofEditor) setSource("site");
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focus]);
  const [stepC, setStepC] = useState("10");
  const [durationMin, setDurationMin] = useState("30");
  const [withBlockage, setWithBlockage] = useState(false);
  const [parameter, setParameter] = useState<SweepParameter>("pvFilterTauS");
  const [valuesText, setValuesText] = useState("0, 1, 2, 4, 8");
  const [pid, setPid] = useState({ kc: String(controller.kc), ti: String(controller.ti), td: String(controller.td || Math.round(controller.ti / 6)) });
  const [pi, setPi] = useState({ kc: String(controller.kc), ti: String(controller.ti) });
  const [metric, setMetric] = useState<MapMetric>("iae");
  const [gridN, setGridN] = useState("20");
  const [spread, setSpread] = useState("4");
  const [error, setError] = useState<string | null>(null);
  const [lastRun, setLastRun] = useState<{ drill: DrillInput; variants: Variant[] } | null>(null);
  const running = state.status === "running";
  const launch = (kind: ExperimentState["kind"], drill: DrillInput, variants: Variant[], meta?: ExperimentState["meta"]) => {
    setLastRun({ drill, variants });
    start(kind, jobsFor(drill, variants, seed), meta);
  };
  const exportExperiment = () => {
    if (!lastRun) return;
    const doc = { drill: lastRun.drill, seed, runs: lastRun.variants.map((v) => ({ label: v.label, controller: controllerConfigSchema.parse(v.controller) })) };
    const url = URL.createObjectURL(new Blob([JSON.stringify(doc, null, 2)], { type: "application/json" }));
    const a = document.createElement("a");
    a.href = url;
    a.download = "loopwright-experiment.json";
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };

  const useSite = !!siteProofEditor && source === "site";
  const proofDrill = (): DrillInput | null => {
    if (useSite) return siteProof ? siteProof.drill : fail("Build the site proof test first (a setpoint ladder with disturbances, or a stored drill).");
    const step = Number(stepC);
    const minutes = Number(durationMin);
    if (!Number.isFinite(step) || step === 0 || Math.abs(step) > 100) return fail("The SP step must be a non-zero number of °C (at most 100).");
    if (!(minutes >= 5 && minutes <= 240)) return fail("Run each variant for 5 to 240 minutes.");
    const durationS = minutes * 60;
    const test: ProofTest = { stepC: step, durationS, ...(withBlockage ? { disturbance: { atS: Math.round(durationS / 2), event: { type: "inlet-blockage", percent: 60 } } } : {}) };
    return experimentDrill(baseDrill, test);
  };
  const fail = (msg: string) => {
    setError(msg);
    return null;
  };

  const run = () => {
    setError(null);
    const drill = proofDrill();
    if (!drill) return;
    if (tab === "sweep") {
      const parsed = parseValueList(valuesText);
      if (!parsed.ok) return void fail(parsed.error);
      launch("sweep", drill, sweepVariants(controller, parameter, parsed.values));
    } else if (tab === "compare") {
      const nums = [pid.kc, pid.ti, pid.td, pi.kc, pi.ti].map(Number);
      if (nums.some((v) => !Number.isFinite(v) || v < 0)) return void fail("Enter non-negative numbers for both tunings.");
      launch("compare", drill, piVersusPidVariants(controller, { kc: nums[0], ti: nums[1], td: nums[2] }, { kc: nums[3], ti: nums[4] }), useSite && siteProof ? { proof: { ...siteProof, seed } } : undefined);
    } else {
      const n = Number(gridN);
      const s = Number(spread);
      if (!(Number.isInteger(n) && n >= 3 && n <= 30)) return void fail("The grid needs 3 to 30 values per axis.");
      if (!(s > 1 && s <= 20)) return void fail("The spread must be above 1 and at most 20.");
      if (!(controller.kc > 0 && controller.ti > 0)) return void fail("The tuning map needs a current Kc and Ti above 0.");
      const kcAxis = geometricAxis(controller.kc, s, n);
      const tiAxis = geometricAxis(controller.ti, s, n);
      launch("map", drill, mapVariants(controller, kcAxis, tiAxis), { kcAxis, tiAxis, metric });
    }
  };

  const tabBtn = (id: typeof tab, label: string) => (
    <button type="button" role="tab" aria-selected={tab === id} onClick={() => setTab(id)} className={`border-b-2 px-1 pb-1 ${tab === id ? "border-ink font-semibold" : "border-transparent text-ink-soft"}`}>
      {label}
    </button>
  );
  const small = "num w-20 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-right";

  return (
    <div className="space-y-3 text-sm">
      <div role="tablist" className="flex gap-3 text-xs">
        {tabBtn("sweep", "Sweep")}
        {tabBtn("compare", "PI vs PID")}
        {tabBtn("map", "Tuning map")}
      </div>
      {siteProofEditor ? (
        <div role="radiogroup" aria-label="Proof test source" className="flex gap-3 text-xs">
          <label className="flex items-center gap-1">
            <input type="radio" name="ex-source" checked={source === "site"} onChange={() => setSource("site")} /> site proof test
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" name="ex-source" checked={source === "step"} onChange={() => setSource("step")} /> one SP step
          </label>
        </div>
      ) : null}
      {/* kept mounted while hidden, so the editor keeps its ladder across a switch */}
      {siteProofEditor ? <div hidden={!useSite}>{siteProofEditor}</div> : null}
      <fieldset hidden={useSite} className="space-y-1.5 rounded-sm border border-rule p-2">
        <legend className="px-1 text-xs text-ink-faint">Proof test (every run)</legend>
        <Row label="SP step at 1:00" id="ex-step">
          <input id="ex-step" value={stepC} onChange={(e) => setStepC(e.target.value)} className={small} />
          <span className="text-xs text-ink-faint">°C</span>
        </Row>
        <Row label="Run length" id="ex-dur">
          <input id="ex-dur" value={durationMin} onChange={(e) => setDurationMin(e.target.value)} className={small} />
          <span className="text-xs text-ink-faint">min</span>
        </Row>
        <label className="flex items-center gap-2 text-xs text-ink-soft">
          <input type="checkbox" checked={withBlockage} onChange={(e) => setWithBlockage(e.target.checked)} /> 60 % inlet blockage at half time
        </label>
      </fieldset>
      {tab === "sweep" ? (
        <div className="space-y-1.5">
          <Row label="Parameter" id="ex-param">
            <select id="ex-param" value={parameter} onChange={(e) => setParameter(e.target.value as SweepParameter)} className="rounded-sm border border-rule-strong bg-paper px-1.5 py-1">
              {Object.entries(SWEEP_PARAMETERS).map(([k, v]) => (
                <option key={k} value={k}>
                  {v.label}
                  {v.unit ? ` (${v.unit})` : ""}
                </option>
              ))}
            </select>
          </Row>
          <Row label="Values" id="ex-values">
            <input id="ex-values" value={valuesText} onChange={(e) => setValuesText(e.target.value)} className="num w-40 rounded-sm border border-rule-strong bg-paper px-1.5 py-1" />
          </Row>
        </div>
      ) : null}
      {tab === "compare" ? (
        <div className="grid grid-cols-[3rem_1fr_1fr_1fr] items-center gap-1.5 text-xs">
          <span />
          <span className="text-ink-faint">Kc %/°C</span>
          <span className="text-ink-faint">Ti s</span>
          <span className="text-ink-faint">Td s</span>
          <span>PI</span>
          <input aria-label="PI Kc" value={pi.kc} onChange={(e) => setPi({ ...pi, kc: e.target.value })} className="num rounded-sm border border-rule-strong bg-paper px-1 py-1 text-right" />
          <input aria-label="PI Ti" value={pi.ti} onChange={(e) => setPi({ ...pi, ti: e.target.value })} className="num rounded-sm border border-rule-strong bg-paper px-1 py-1 text-right" />
          <span className="num text-center text-ink-faint">0</span>
          <span>PID</span>
          <input aria-label="PID Kc" value={pid.kc} onChange={(e) => setPid({ ...pid, kc: e.target.value })} className="num rounded-sm border border-rule-strong bg-paper px-1 py-1 text-right" />
          <input aria-label="PID Ti" value={pid.ti} onChange={(e) => setPid({ ...pid, ti: e.target.value })} className="num rounded-sm border border-rule-strong bg-paper px-1 py-1 text-right" />
          <input aria-label="PID Td" value={pid.td} onChange={(e) => setPid({ ...pid, td: e.target.value })} className="num rounded-sm border border-rule-strong bg-paper px-1 py-1 text-right" />
          {suggested ? (
            <p className="col-span-4 text-ink-faint" data-testid="compare-suggestion">
              Filled in from {RULE_LABELS[suggested.rule] ?? suggested.rule} on the {suggested.source === "relay" ? "relay result" : "bump model"}, for PI and for PID.
            </p>
          ) : null}
        </div>
      ) : null}
      {tab === "map" ? (
        <div className="space-y-1.5">
          <Row label="Result" id="ex-metric">
            <select id="ex-metric" value={metric} onChange={(e) => setMetric(e.target.value as MapMetric)} className="rounded-sm border border-rule-strong bg-paper px-1.5 py-1">
              {Object.entries(MAP_METRICS).map(([k, v]) => (
                <option key={k} value={k}>
                  {v.label}
                </option>
              ))}
            </select>
          </Row>
          <Row label="Grid (n × n)" id="ex-grid">
            <input id="ex-grid" value={gridN} onChange={(e) => setGridN(e.target.value)} className={small} />
          </Row>
          <Row label="Spread (÷ and ×)" id="ex-spread">
            <input id="ex-spread" value={spread} onChange={(e) => setSpread(e.target.value)} className={small} />
          </Row>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="text-xs text-alarm">
          {error}
        </p>
      ) : null}
      <div className="flex items-center gap-2">
        <button type="button" onClick={run} disabled={running} className="rounded-sm bg-ink px-3 py-1.5 text-sm font-semibold text-paper disabled:opacity-50">
          Run experiment
        </button>
        {running ? (
          <button type="button" onClick={cancel} className="rounded-sm border border-rule-strong px-3 py-1.5 text-sm hover:border-ink">
            Cancel
          </button>
        ) : null}
      </div>
      {state.status !== "idle" ? (
        <div>
          <div className="h-1.5 overflow-hidden rounded-full bg-paper-sunk" role="progressbar" aria-valuemin={0} aria-valuemax={state.total} aria-valuenow={state.done} aria-label="Experiment progress">
            <div className="h-full bg-trace-pv transition-[width]" style={{ width: `${state.total ? (100 * state.done) / state.total : 0}%` }} />
          </div>
          <p className="num mt-1 text-xs text-ink-faint" data-testid="experiment-status">
            {state.done} / {state.total} runs · {state.status}
            {state.elapsedMs != null ? ` · ${(state.elapsedMs / 1000).toFixed(1)} s` : ""}
            {state.error ? ` · ${state.error}` : ""}
          </p>
          {state.status === "done" && lastRun ? (
            <button type="button" onClick={exportExperiment} className="mt-1 text-xs underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
              Export the experiment (drill and controllers, JSON) for the CLI
            </button>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}

function Row({ label, id, children }: { label: string; id: string; children: React.ReactNode }) {
  return (
    <div className="flex items-center justify-between gap-2">
      <label htmlFor={id} className="text-ink-soft">
        {label}
      </label>
      <span className="flex items-center gap-1.5">{children}</span>
    </div>
  );
}
