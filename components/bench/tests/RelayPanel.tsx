"use client";
/**
 * Relay test on the Bench's loop (sim/tuning/relay/relay-test.ts, run by the worker). The test
 * starts with the noise check armed (stopOnNoiseWarning), so a hysteresis narrower than 3σ of
 * the PV noise is reported before the relay ever switches; "Start anyway" runs it past the
 * warning. Live progress comes from the store (the worker posts it about ten times a second).
 */
import { useMemo, useState } from "react";
import type { ControllerConfig } from "@/sim/control/config";
import type { RelayAbort, RelayOutcome, RelayProgress, RelayResult, RelayTestOptions } from "@/sim/tuning/relay/relay-test";
import type { BlockForm } from "@/sim/tuning/rules/form-conversion";
import type { ControllerType } from "@/sim/tuning/rules/tuning";
import { gainPerCelsiusToDisplay, temperatureDeltaFromDisplay, temperatureDeltaToDisplay, temperatureToDisplay } from "@/sim/units";
import { Duration, Qty } from "../plants/format";
import { useBench, type DisplayUnits } from "../store";
import { FORM_LABELS, RULE_LABELS, ruleChoices } from "./labels";
import { ProposalView, type ProposalOrigin } from "./ProposalView";
import { UnitRow } from "@/components/forms/UnitRow";

export interface RelayPanelProps {
  units: DisplayUnits;
  /** transmitter span, °C (for the proportional band) */
  spanC: number;
  /** the controller's present form (the default form of the proposal) */
  controllerForm: BlockForm;
  onStart: (options: RelayTestOptions, speed: "bench" | "max") => void;
  onCancel: () => void;
  onApply: (cfg: ControllerConfig, origin?: ProposalOrigin) => void;
}

const PHASES: Record<string, string> = {
  quiet: "quiet window: measuring the PV noise",
  kick: "kick: relay to its high level",
  relay: "relay oscillating",
  returning: "handing the loop back",
  done: "done",
  aborted: "stopped",
};

const num = (s: string) => Number(s.trim().replace(",", "."));

export function RelayPanel({ units, spanC, controllerForm, onStart, onCancel, onApply }: RelayPanelProps) {
  const test = useBench((s) => s.test);
  const [levels, setLevels] = useState<"amplitude" | "explicit">("amplitude");
  const [amplitude, setAmplitude] = useState("10");
  const [high, setHigh] = useState("");
  const [low, setLow] = useState("");
  const [hysteresis, setHysteresis] = useState("");
  const [cycles, setCycles] = useState("3");
  const [rule, setRule] = useState("");
  const [controller, setController] = useState<ControllerType>("PID");
  const [form, setForm] = useState<BlockForm>(controllerForm);
  const [pace, setPace] = useState<"bench" | "max">("bench");
  const [error, setError] = useState<string | null>(null);
  const [lastOptions, setLastOptions] = useState<RelayTestOptions | null>(null);

  const T = `°${units.temperature}`;
  const relay = test?.kind === "relay" ? test : null;
  const running = test?.status === "running";
  const otherRunning = running && test?.kind !== "relay";
  const outcome: RelayOutcome | null = relay?.outcome?.test === "relay" ? relay.outcome.outcome : null;
  const base = relay?.outcome?.test === "relay" ? relay.outcome.base : null;
  const progress = relay?.progress?.test === "relay" ? relay.progress.progress : null;

  const readOptions = (): RelayTestOptions | null => {
    const o: RelayTestOptions = { rule: rule || undefined, controller, form };
    if (levels === "amplitude") {
      const a = num(amplitude);
      if (!(a > 0 && a <= 50)) return setError("Relay amplitude: a number of % between 0 and 50."), null;
      o.amplitudePercent = a;
    } else {
      const h = num(high);
      const l = num(low);
      if (!Number.isFinite(h) || !Number.isFinite(l) || !(h > l)) return setError("Relay levels: high and low OUT in %, high above low."), null;
      o.highPercent = h;
      o.lowPercent = l;
    }
    if (hysteresis.trim() !== "") {
      const e = num(hysteresis);
      if (!(e >= 0)) return setError(`Hysteresis ε: a temperature difference in ${T}, or blank for automatic (3σ).`), null;
      o.hysteresisC = temperatureDeltaFromDisplay(e, units.temperature);
    }
    const c = num(cycles);
    if (!(Number.isInteger(c) && c >= 1 && c <= 20)) return setError("Cycles: a whole number from 1 to 20."), null;
    o.cycles = c;
    setError(null);
    return o;
  };

  const start = (e?: React.FormEvent) => {
    e?.preventDefault();
    const o = readOptions();
    if (!o) return;
    const armed = { ...o, stopOnNoiseWarning: true };
    setLastOptions(armed);
    onStart(armed, pace);
  };
  const startAnyway = () => {
    const from = lastOptions ?? readOptions();
    if (!from) return;
    const o = { ...from, stopOnNoiseWarning: false };
    setLastOptions(o);
    onStart(o, pace);
  };

  const input = "num w-16 rounded-sm border border-rule-strong bg-paper px-1.5 py-0.5 text-right text-xs";
  const select = "rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs";
  return (
    <div className="space-y-3 text-sm" data-testid="relay-panel">
      <form onSubmit={start} aria-label="Relay test settings" className="space-y-1.5 text-xs" noValidate>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="rt-levels" className="text-ink-soft">
            Relay levels
          </label>
          <select id="rt-levels" value={levels} onChange={(e) => setLevels(e.target.value as typeof levels)} className={select}>
            <option value="amplitude">± amplitude around OUT</option>
            <option value="explicit">high and low OUT</option>
          </select>
        </div>
        {levels === "amplitude" ? (
          <UnitRow id="rt-amplitude" label="Relay amplitude" unit="%">
            <input id="rt-amplitude" inputMode="decimal" value={amplitude} onChange={(e) => setAmplitude(e.target.value)} className={input} />
          </UnitRow>
        ) : (
          <>
            <UnitRow id="rt-high" label="High OUT" unit="%">
              <input id="rt-high" inputMode="decimal" value={high} onChange={(e) => setHigh(e.target.value)} className={input} />
            </UnitRow>
            <UnitRow id="rt-low" label="Low OUT" unit="%">
              <input id="rt-low" inputMode="decimal" value={low} onChange={(e) => setLow(e.target.value)} className={input} />
            </UnitRow>
          </>
        )}
        <UnitRow id="rt-hysteresis" label="Hysteresis ε" unit={T}>
          <input id="rt-hysteresis" inputMode="decimal" placeholder="auto" value={hysteresis} onChange={(e) => setHysteresis(e.target.value)} className={input} />
        </UnitRow>
        <p className="text-right text-[11px] text-ink-faint">blank = automatic, 3σ of the PV noise; the relay switches at SP ± ε</p>
        <UnitRow id="rt-cycles" label="Cycles measured" unit="">
          <input id="rt-cycles" inputMode="numeric" value={cycles} onChange={(e) => setCycles(e.target.value)} className={input} />
        </UnitRow>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="rt-rule" className="text-ink-soft">
            Rule
          </label>
          <select id="rt-rule" value={rule} onChange={(e) => setRule(e.target.value)} className={select}>
            <option value="">recommended</option>
            {ruleChoices({ ultimate: true, model: true }).map((r) => (
              <option key={r} value={r}>
                {RULE_LABELS[r] ?? r}
              </option>
            ))}
          </select>
        </div>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="rt-controller" className="text-ink-soft">
            Controller
          </label>
          <select id="rt-controller" value={controller} onChange={(e) => setController(e.target.value as ControllerType)} className={select}>
            <option value="PI">PI</option>
            <option value="PID">PID</option>
          </select>
        </div>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="rt-form" className="text-ink-soft">
            Form
          </label>
          <select id="rt-form" value={form} onChange={(e) => setForm(e.target.value as BlockForm)} className={select}>
            {(Object.keys(FORM_LABELS) as BlockForm[]).map((f) => (
              <option key={f} value={f}>
                {FORM_LABELS[f]}
              </option>
            ))}
          </select>
        </div>
        <div className="flex items-center justify-between gap-2">
          <label htmlFor="rt-pace" className="text-ink-soft">
            Run the test
          </label>
          <select id="rt-pace" value={pace} onChange={(e) => setPace(e.target.value as typeof pace)} className={select}>
            <option value="bench">at the Bench speed</option>
            <option value="max">as fast as possible</option>
          </select>
        </div>
        {error ? (
          <p role="alert" className="text-alarm">
            {error}
          </p>
        ) : null}
        {running && relay ? (
          <button type="button" onClick={onCancel} className="w-full rounded-sm border border-rule-strong px-3 py-1.5 text-sm hover:border-ink">
            Cancel the relay test
          </button>
        ) : (
          <button type="submit" disabled={otherRunning} className="w-full rounded-sm bg-ink px-3 py-1.5 text-sm font-semibold text-paper hover:bg-ink-soft disabled:opacity-50">
            Start relay test
          </button>
        )}
        {otherRunning ? <p className="text-ink-faint">A bump test is running; cancel it or wait for it to finish.</p> : null}
      </form>

      {relay && progress && (running || !outcome || !outcome.ok) ? <RelayProgressView progress={progress} units={units} running={running} /> : null}

      {outcome && !outcome.ok ? (
        outcome.code === "noise-warning" ? (
          <NoiseWarning outcome={outcome} hysteresisC={lastOptions?.hysteresisC} units={units} onStartAnyway={startAnyway} />
        ) : (
          <div role="status" className="rounded-sm border border-caution/50 bg-caution-soft px-2 py-1.5 text-xs text-caution" data-testid="relay-abort">
            <p className="font-semibold">{outcome.code === "noise" ? "Noise fooled the relay: test stopped" : outcome.code === "cancelled" ? "Relay test cancelled" : "Relay test stopped"}</p>
            <p>{outcome.message}</p>
          </div>
        )
      ) : null}

      {outcome && outcome.ok && base ? <RelayResultView result={outcome} base={base} units={units} spanC={spanC} onApply={onApply} initial={{ rule: lastOptions?.rule, controller: lastOptions?.controller, form: lastOptions?.form }} /> : null}
      {!relay ? <p className="text-xs text-ink-soft">Bring the loop near its operating point first (manual, or a settled auto run). The test holds OUT, measures the noise, then switches OUT between two levels around SP and reads the ultimate gain and period from the oscillation.</p> : null}
    </div>
  );
}

function RelayProgressView({ progress: p, units: u, running: live }: { progress: RelayProgress; units: DisplayUnits; running: boolean }) {
  const last = p.halfPeriodsS.slice(-6);
  return (
    <div className="rounded-sm border border-rule px-2 py-1.5 text-xs" data-testid="relay-progress" aria-live="polite">
      <p className="mb-1 flex justify-between">
        <span className="font-semibold" data-testid="relay-phase">
          {PHASES[p.phase] ?? p.phase}
        </span>
        {live ? <span className="text-ink-faint">running</span> : null}
      </p>
      <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
        <dt className="text-ink-soft">Crossings</dt>
        <dd className="num" data-testid="relay-crossings">
          {p.crossings}
        </dd>
        <dt className="text-ink-soft">Cycles measured</dt>
        <dd className="num">{p.cyclesMeasured}</dd>
        <dt className="text-ink-soft">Half-periods</dt>
        <dd className="num">{last.length ? `${p.halfPeriodsS.length > last.length ? "… " : ""}${last.map((h) => h.toFixed(1)).join(", ")} s` : "—"}</dd>
        <dt className="text-ink-soft">Amplitude a</dt>
        <dd>{p.amplitudeC === null ? <Qty value={null} unit={`°${u.temperature}`} /> : <Qty value={temperatureDeltaToDisplay(p.amplitudeC, u.temperature)} unit={`°${u.temperature}`} />}</dd>
        <dt className="text-ink-soft">Ku (running)</dt>
        <dd>{p.kuEstimate === null ? <Qty value={null} unit={`%/°${u.temperature}`} /> : <Qty value={gainPerCelsiusToDisplay(p.kuEstimate, u.temperature)} unit={`%/°${u.temperature}`} />}</dd>
        <dt className="text-ink-soft">Pu (running)</dt>
        <dd>
          <Duration seconds={p.puEstimateS} />
        </dd>
      </dl>
    </div>
  );
}

function NoiseWarning({ outcome, hysteresisC, units, onStartAnyway }: { outcome: RelayAbort; hysteresisC: number | undefined; units: DisplayUnits; onStartAnyway: () => void }) {
  const sigma = outcome.start?.noiseSigmaC ?? null;
  const d = (c: number | null | undefined) => (c === null || c === undefined ? null : temperatureDeltaToDisplay(c, units.temperature));
  const T = `°${units.temperature}`;
  return (
    <div role="alert" className="space-y-1.5 rounded-sm border border-caution/50 bg-caution-soft px-2 py-2 text-xs text-ink" data-testid="relay-noise-warning">
      <p className="font-semibold text-caution">Noise check: the hysteresis is narrower than the noise</p>
      <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
        <dt>Hysteresis ε</dt>
        <dd>
          <Qty value={d(hysteresisC)} unit={T} />
        </dd>
        <dt>3σ of the PV the controller sees</dt>
        <dd>
          <Qty value={sigma === null ? null : d(3 * sigma)} unit={T} />
        </dd>
      </dl>
      <p>Noise may switch the relay before the process does, and the crossings would be false. Add a PV filter (about a quarter of the sensor lag) in the controller, or widen ε to at least 3σ, or leave ε blank for automatic; then start again.</p>
      <button type="button" onClick={onStartAnyway} className="rounded-sm border border-ink px-2.5 py-1 font-semibold hover:bg-paper">
        Start anyway
      </button>
    </div>
  );
}

function RelayResultView({ result: r, base, units, spanC, onApply, initial }: { result: RelayResult; base: ControllerConfig; units: DisplayUnits; spanC: number; onApply: (cfg: ControllerConfig, origin?: ProposalOrigin) => void; initial: { rule?: string; controller?: ControllerType; form?: BlockForm } }) {
  const T = `°${units.temperature}`;
  const dT = (c: number) => temperatureDeltaToDisplay(c, units.temperature);
  const g = (k: number) => gainPerCelsiusToDisplay(k, units.temperature);
  const ultimate = useMemo(() => ({ ku: r.ku, puS: r.puS }), [r]);
  const model = r.fopdt.model ?? undefined;
  return (
    <div className="space-y-3" data-testid="relay-result">
      <div className="text-xs">
        <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-faint">Relay result</h3>
        <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
          <dt className="text-ink-soft">Ultimate gain Ku</dt>
          <dd data-testid="relay-ku">
            <Qty value={g(r.ku)} unit={`%/${T}`} />
          </dd>
          <dt className="col-span-2 text-[11px] text-ink-faint">Ku = 4d/(π√(a² − ε²)), the hysteresis convention; 4d/(πa) gives {String(+g(r.kuIdealFormula).toPrecision(3))} %/{T}</dt>
          <dt className="text-ink-soft">Ultimate period Pu</dt>
          <dd>
            <Duration seconds={r.puS} />
          </dd>
          <dt className="text-ink-soft">Half-periods high / low</dt>
          <dd className="num">
            {r.highHalfPeriodS.toFixed(1)} / {r.lowHalfPeriodS.toFixed(1)} s
          </dd>
          <dt className="text-ink-soft">PV amplitude a</dt>
          <dd>
            <Qty value={dT(r.amplitudeC)} unit={T} />
          </dd>
          <dt className="text-ink-soft">Relay d (half the OUT swing)</dt>
          <dd>
            <Qty value={r.dPercent} unit="%" />
          </dd>
          <dt className="text-ink-soft">Relay bias</dt>
          <dd>
            <Qty value={r.biasPercent} unit="%" />
          </dd>
          <dt className="text-ink-soft">Hysteresis ε</dt>
          <dd>
            <Qty value={dT(r.hysteresisC)} unit={T} />
          </dd>
          <dt className="text-ink-soft">PV noise σ at the start</dt>
          <dd>
            <Qty value={dT(r.start.noiseSigmaC)} unit={T} />
          </dd>
          <dt className="text-ink-soft">Settling cycles discarded</dt>
          <dd className="num">{r.settlingCyclesUsed}</dd>
          <dt className="text-ink-soft">Test time</dt>
          <dd>
            <Duration seconds={r.durationS} />
          </dd>
        </dl>
      </div>
      <div className="text-xs" data-testid="relay-fopdt">
        <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-faint">FOPDT estimate</h3>
        {r.fopdt.model ? (
          <>
            <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
              <dt className="text-ink-soft">Gain K</dt>
              <dd>
                <Qty value={dT(r.fopdt.model.gainCPerPercent)} unit={`${T}/%`} />
              </dd>
              <dt className="text-ink-soft">Time constant τ</dt>
              <dd>
                <Duration seconds={r.fopdt.model.timeConstantS} />
              </dd>
              <dt className="text-ink-soft">Dead time θ</dt>
              <dd>
                <Duration seconds={r.fopdt.model.deadTimeS} />
              </dd>
            </dl>
            <p className="mt-0.5 text-ink-faint">
              {r.fopdt.gainSource === "power-curve"
                ? "K from the power curve (the plant's steady state at the mean relay OUT ± 1 %); τ and θ from Ku and Pu."
                : "K from the test's mean OUT and PV against their starting values; τ and θ from Ku and Pu."}
            </p>
          </>
        ) : (
          <p className="text-ink-soft">No FOPDT estimate: {r.fopdt.reason}</p>
        )}
      </div>
      <p className="text-xs text-ink-soft" data-testid="relay-sp-tracking">
        {r.start.setpointTracksPv
          ? `SP tracked PV at the start (SP tracking in manual): the relay switched around ${temperatureToDisplay(r.start.relayCentreC, units.temperature).toFixed(2)} ${T}, the PV then, not the operator's SP.`
          : `SP did not track PV: the relay switched around the SP, ${temperatureToDisplay(r.start.relayCentreC, units.temperature).toFixed(2)} ${T}.`}
      </p>
      {r.warnings.length ? (
        <ul className="list-disc space-y-0.5 pl-4 text-xs text-ink-soft">
          {r.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
      <ProposalView idPrefix="relay" ultimate={ultimate} model={model} base={base} initial={initial} sampleTimeAndFilter={r.sampleTimeAndFilter} units={units} spanC={spanC} onApply={onApply} />
    </div>
  );
}
