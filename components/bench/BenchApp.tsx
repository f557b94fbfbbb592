"use client";
/**
 * The Bench: plant and controller on the left, the trend with its run controls and results in
 * the middle, the faceplate, disturbances and tests on the right. The engine runs in a Web
 * Worker; this component only sends commands and shows what streams back.
 */
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import Link from "next/link";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import { drillSchema } from "@/sim/drill/schema";
import { noiseSigmaC, resolveCutout, resolvePlant, resolveSensor } from "@/sim/drill/resolve";
import { PLANT_PRESETS } from "@/sim/plant/presets";
import { derivedFigures, steadyStateTemperatureC } from "@/sim/plant/derived-figures";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import type { StampedAction } from "@/sim/drill/actions";
import type { DrillInput } from "@/sim/drill/schema";
import { PlantEditor } from "./plants/PlantEditor";
import { PlantPicker } from "./plants/PlantPicker";
import { RunHistory, type SavedRunFull } from "./saved/RunHistory";
import { TuningSets } from "./saved/TuningSets";
import { currentRunRecord, type CurrentRunRecord } from "./current-run";
import { temperatureDeltaToDisplay, temperatureToDisplay } from "@/sim/units";
import { TrendPanel } from "@/components/bench/TrendPanel";
import { BENCH_DURATION_S, BENCH_START_TUNING, benchDrill, plantDefinitionOf, type BenchPlant } from "./bench-drill";
import { benchWindows } from "./bench-results";
import { ControllerForm } from "./ControllerForm";
import { DisturbancePanel } from "./DisturbancePanel";
import { BenchEngine } from "./engine-client";
import { Faceplate, type FaceplateProps } from "./Faceplate";
import { useShallow } from "zustand/react/shallow";
import { HelpOverlay } from "./HelpOverlay";
import { ResultsTable } from "./ResultsTable";
import { BENCH_SPEEDS, RunControls } from "./RunControls";
import { NO_FINDINGS, useBench, type BenchPanelId } from "./store";
import { sensorMatching, type SensorFromData } from "./sensor-from-data";
import type { ExperimentState } from "./experiments/use-experiments";
import { proofRunsOf } from "./experiments/proof-runs";
import { isArrowKey, operatorKeyAction } from "./operator-keys";
import { makeReplayBundle } from "@/sim/drill/replay-bundle";
import { ExperimentsPanel } from "./experiments/ExperimentsPanel";
import { ExperimentTable } from "./experiments/ExperimentTable";
import { OverlayChart } from "./experiments/OverlayChart";
import { TuningMap } from "./experiments/TuningMap";
import { useExperiments } from "./experiments/use-experiments";
import { BumpPanel } from "./tests/BumpPanel";
import { PowerCurvePanel } from "./tests/PowerCurvePanel";
import { RelayPanel } from "./tests/RelayPanel";
import type { ProposalOrigin } from "./tests/ProposalView";
import type { MapMetric } from "@/sim/experiments/tuning-map";
import { parsePlantRef } from "@/app/_lib/plant-ref";

const DEFAULT_SEED = 20261201;

function isTyping(target: EventTarget | null) {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === "INPUT" || el.tagName === "SELECT" || el.tagName === "TEXTAREA" || el.isContentEditable);
}

/** What the worker runs: a fresh run on a plant, a restart with a new sample time, or a saved run reopened. */
interface BenchRun {
  drill: DrillInput;
  controller: ControllerConfig;
  seed: number;
  actions: StampedAction[];
  /** reopened saved runs replay to their end at once */
  autoRun: boolean;
}

/** Trip point for a stored plant (the drill needs one): 90 % of the way from ambient to the 100 % steady state. */
function defaultTripC(def: PlantDefinition): number {
  const amb = steadyStateTemperatureC(def, 0);
  return Math.round(amb + 0.9 * (steadyStateTemperatureC(def, 100) - amb));
}

function startingSetpoint(def: PlantDefinition): number {
  // a twin starts where it was identified
  if (def.kind === "transfer-function") return def.operatingPoint.temperatureC;
  const amb = steadyStateTemperatureC(def, 0);
  const top = steadyStateTemperatureC(def, 100);
  return top - amb > 70 ? 60 : Math.round(amb + 0.5 * (top - amb));
}

/** A stored plant the Bench opens with (the pre-commissioning flow's plant). */
export interface BenchStartPlant {
  ref: string;
  title: string;
  definition: PlantDefinition;
  origin: "physical" | "twin";
  /** a twin's noise σ and quantization step read from its uploaded log, when known */
  sensorFromData: SensorFromData | null;
  /** the plant is the user's own and not shared (a tuning record on it is still read organisation-wide) */
  privateToUser?: boolean;
}

/** Sensor range for a stored plant: the default 0–200 °C, widened when the cutout sits near its top. */
function rangeHighFor(tripC: number): number {
  return tripC > 190 ? Math.ceil((tripC + 50) / 100) * 100 : 200;
}

function storedPlant(def: PlantDefinition, sensorFromData: SensorFromData | null = null): BenchPlant {
  const tripC = defaultTripC(def);
  return { kind: "stored", definition: def, cutoutTripC: tripC, ...(sensorFromData ? { sensor: sensorMatching(sensorFromData, rangeHighFor(tripC)).sensor } : {}) };
}

export interface BenchAppProps {
  initialPresetId?: string;
  startPlant?: BenchStartPlant;
  /** the pre-commissioning flow: its panel above the Bench and its site proof-test editor in the experiments */
  commissioning?: { header: ReactNode; proofEditor: (baseDrill: DrillInput) => ReactNode };
}

export function BenchApp({ initialPresetId = PLANT_PRESETS[0].id, startPlant, commissioning }: BenchAppProps) {
  const engineRef = useRef<BenchEngine | null>(null);
  const [engine, setEngine] = useState<BenchEngine | null>(null);
  const initialPlant: BenchPlant = startPlant ? storedPlant(startPlant.definition, startPlant.sensorFromData) : { kind: "preset", presetId: initialPresetId };
  const initialTitle = startPlant ? startPlant.title : (PLANT_PRESETS.find((p) => p.id === initialPresetId)?.title ?? "");
  const [plantRef, setPlantRef] = useState(startPlant ? startPlant.ref : `preset:${initialPresetId}`);
  const [plant, setPlant] = useState<BenchPlant>(initialPlant);
  const [plantTitle, setPlantTitle] = useState(initialTitle);
  const [controller, setController] = useState<ControllerConfig>(() => controllerConfigSchema.parse(BENCH_START_TUNING));
  const [seed] = useState(DEFAULT_SEED);
  const [editing, setEditing] = useState<null | { plant?: { id: string; name: string; description: string; definition: PlantDefinition } }>(null);
  const freshRun = useCallback(
    (p: BenchPlant, title: string, cfg: ControllerConfig): BenchRun => {
      const def = plantDefinitionOf(p);
      return { drill: benchDrill({ plant: p, title, setpointC: startingSetpoint(def), reference: cfg, seed }), controller: cfg, seed, actions: [], autoRun: false };
    },
    [seed],
  );
  const [run, setRun] = useState<BenchRun>(() => freshRun(initialPlant, initialTitle, controllerConfigSchema.parse(BENCH_START_TUNING)));
  // the snapshot changes at chunk rate: only the small live components below subscribe to it
  const { status, speed, events, units, showTruth, showRaw, helpOpen, engineVersion, error, set } = useBench(
    useShallow((s) => ({ status: s.status, speed: s.speed, events: s.events, units: s.units, showTruth: s.showTruth, showRaw: s.showRaw, helpOpen: s.helpOpen, engineVersion: s.engineVersion, error: s.error, set: s.set })),
  );

  const drill = run.drill;
  const parsedDrill = useMemo(() => drillSchema.parse(drill), [drill]);
  const sensor = useMemo(() => resolveSensor(parsedDrill), [parsedDrill]);
  const cutout = useMemo(() => resolveCutout(parsedDrill), [parsedDrill]);
  const spanC = sensor.transmitter.rangeHighC - sensor.transmitter.rangeLowC;
  const definition = useMemo(() => resolvePlant(parsedDrill), [parsedDrill]);
  const figures = useMemo(() => derivedFigures(definition, Number(drill.initialState.outPercent ?? 30)), [definition, drill]);

  // one worker per Bench
  useEffect(() => {
    const e = new BenchEngine();
    engineRef.current = e;
    setEngine(e);
    return () => e.dispose();
  }, []);

  // every new run goes to the worker; tuning changes within a run are actions instead
  useEffect(() => {
    if (!engine) return;
    engine.load(run.drill, run.controller, run.seed, run.actions);
    if (run.autoRun) engine.run("max");
  }, [engine, run]);
  const startController = run.controller;

  // what the tests found belongs to one plant
  useEffect(() => {
    useBench.getState().set({ findings: NO_FINDINGS, siteProof: null, savedTuningSet: null });
  }, [plantRef]);

  const choosePlant = (ref: string, def: PlantDefinition, title: string) => {
    // the pre-commissioning flow is for one plant: another plant means another flow (or the free Bench)
    if (commissioning && ref !== plantRef) {
      const chosen = parsePlantRef(ref);
      window.location.assign(chosen?.kind === "plant" ? `/commissioning/${chosen.plantId}` : "/bench");
      return;
    }
    const chosen = parsePlantRef(ref);
    const next: BenchPlant = chosen?.kind === "preset" ? { kind: "preset", presetId: chosen.presetId } : ref === startPlant?.ref ? storedPlant(def, startPlant.sensorFromData) : storedPlant(def);
    setPlantRef(ref);
    setPlant(next);
    setPlantTitle(title);
    setRun(freshRun(next, title, controller));
  };
  const restartWith = (cfg: ControllerConfig) => {
    setController(cfg);
    setRun(freshRun(plant, plantTitle, cfg));
  };
  const openSaved = (saved: SavedRunFull) => {
    setController(controllerConfigSchema.parse(saved.controller));
    setPlantRef(saved.plantRef);
    setRun({ drill: saved.drill as DrillInput, controller: controllerConfigSchema.parse(saved.controller), seed: saved.seed, actions: saved.actionLog, autoRun: true });
  };

  const act = engineRef.current;
  const experiments = useExperiments();
  const [testsTab, setTestsTab] = useState<"relay" | "bump" | "experiments">("experiments");
  const loadTuning = (patch: Partial<ControllerConfig>) => {
    const cfg = controllerConfigSchema.parse({ ...controller, ...patch });
    if (cfg.sampleTimeS !== controller.sampleTimeS) return restartWith(cfg);
    setController(cfg);
    act?.act({ type: "tuning", controller: cfg });
  };
  const applyProposal = (source: "relay" | "bump") => (cfg: ControllerConfig, origin?: ProposalOrigin) => {
    loadTuning(cfg);
    if (origin) useBench.getState().noteApplied(source, origin, controllerConfigSchema.parse({ ...controller, ...cfg }));
  };

  // a finished comparison on the site proof test is kept run by run, as it was run
  const recordedExperiment = useRef<ExperimentState | null>(null);
  useEffect(() => {
    const st = experiments.state;
    const proof = st.meta?.proof;
    if (st.status !== "done" || st.kind !== "compare" || !proof || recordedExperiment.current === st) return;
    recordedExperiment.current = st;
    const { findings, note } = useBench.getState();
    const runs = proofRunsOf(proof, st.rows, Date.now().toString(36));
    note({ proofRuns: [...findings.proofRuns, ...runs].slice(-16) });
  }, [experiments.state]);

  // the hand-over path asks for a panel: open its tab, then bring it into view and focus it
  const panelRefs = {
    "power-curve": useRef<HTMLDivElement>(null),
    relay: useRef<HTMLDivElement>(null),
    bump: useRef<HTMLDivElement>(null),
    proof: useRef<HTMLDivElement>(null),
    "tuning-sets": useRef<HTMLElement>(null),
  } satisfies Record<BenchPanelId, unknown>;
  const focus = useBench((s) => s.focus);
  useEffect(() => {
    if (!focus) return;
    const tab = ({ "power-curve": "bump", bump: "bump", relay: "relay", proof: "experiments", "tuning-sets": null } as const)[focus.panel];
    if (tab) setTestsTab(tab);
    const id = requestAnimationFrame(() => {
      const el = panelRefs[focus.panel].current;
      el?.scrollIntoView?.({ block: "start", behavior: "smooth" });
      el?.focus({ preventScroll: true });
    });
    return () => cancelAnimationFrame(id);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focus]);
  const compareSaved = (runs: SavedRunFull[]) =>
    experiments.start(
      "saved",
      runs.map((r) => ({ label: r.title || new Date(r.createdAt).toLocaleString("en-GB"), drill: r.drill, controller: r.controller, seed: r.seed, actions: r.actionLog })),
    );

  // the record RunHistory saves: computed once the run is paused, from the streamed trace
  const [currentRun, setCurrentRun] = useState<CurrentRunRecord | null>(null);
  useEffect(() => {
    if (status !== "paused" || !engineRef.current) return;
    const s = useBench.getState();
    setCurrentRun(currentRunRecord({ drill, controller: startController, seed: run.seed, actions: s.actionLog, trace: engineRef.current.buffer.view(), events: s.events, engineVersion: s.engineVersion }));
  }, [status, drill, startController, run.seed, events]);

  const [exportPending, setExportPending] = useState(false);
  const fingerprint = useBench((s) => s.fingerprint);
  useEffect(() => {
    if (!exportPending || !fingerprint) return;
    setExportPending(false);
    const s = useBench.getState();
    const bundle = makeReplayBundle({ engineVersion: s.engineVersion, drill, controller: startController, seed: run.seed, actions: s.actionLog, rows: fingerprint.rows, fingerprint: fingerprint.value });
    const url = URL.createObjectURL(new Blob([JSON.stringify(bundle, null, 2)], { type: "application/json" }));
    const a = document.createElement("a");
    a.href = url;
    a.download = "loopwright-replay.json";
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }, [exportPending, fingerprint, drill, startController, run.seed]);
  const exportReplay = () => {
    useBench.getState().set({ fingerprint: null });
    setExportPending(true);
    act?.requestFingerprint();
  };

  const onSetpoint = (spC: number) => act?.act({ type: "setpoint", setpointC: spC });
  const onMode = (mode: "auto" | "manual") => act?.act({ type: "mode", mode });
  const onManualOutput = (outPercent: number) => act?.act({ type: "manual-output", outPercent });

  // keyboard first
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isTyping(e.target) || e.ctrlKey || e.metaKey || e.altKey) return;
      const s = useBench.getState();
      const snap = s.snapshot;
      const eng = engineRef.current;
      if (!eng) return;
      if (e.key === " ") {
        e.preventDefault();
        if (s.status === "running") eng.pause();
        else eng.run(s.speed);
      } else if (e.key === ".") eng.step(1);
      else if (e.key === "t" || e.key === "T") s.set({ showTruth: !s.showTruth });
      else if (e.key === "?") s.set({ helpOpen: !s.helpOpen });
      else if (e.key === "Escape") s.set({ helpOpen: false });
      else if (/^[1-5]$/.test(e.key)) eng.run(BENCH_SPEEDS[Number(e.key) - 1].value);
      else if (snap) {
        if (isArrowKey(e.key)) e.preventDefault();
        const action = operatorKeyAction(e, snap, s.units.temperature);
        if (action) eng.act(action);
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, []);

  // results recomputed at most twice a second
  const [windows, setWindows] = useState<ReturnType<typeof benchWindows>>([]);
  useEffect(() => {
    const id = setInterval(() => {
      const b = engineRef.current?.buffer;
      if (b) setWindows(benchWindows(b.view(), useBench.getState().events, noiseSigmaC(sensor), cutout.tripPointC));
    }, 500);
    return () => clearInterval(id);
  }, [sensor, cutout]);

  const t = (c: number) => `${temperatureToDisplay(c, units.temperature).toFixed(1)} °${units.temperature}`;
  const dT = (c: number) => `${String(+temperatureDeltaToDisplay(c, units.temperature).toPrecision(2))} °${units.temperature}`;
  // a twin's chain carries its log's noise and step; the Bench's ADC can only match the step to whole bits
  const data = plantRef === startPlant?.ref ? startPlant.sensorFromData : null;
  const match = data ? sensorMatching(data, sensor.transmitter.rangeHighC) : null;
  const sensorNote =
    data && match
      ? [
          data.noiseSigmaC !== null ? `σ ≈ ${dT(data.noiseSigmaC)}` : null,
          data.quantizationStepC !== null ? `step ${dT(data.quantizationStepC)}${match.stepC !== null && match.bits !== null ? ` (the Bench's ${match.bits}-bit input: ${dT(match.stepC)})` : ""}` : null,
        ]
          .filter(Boolean)
          .join(", ")
      : null;

  const currentRef = parsePlantRef(plantRef);
  const grid = (
    <div className="grid gap-4 xl:grid-cols-[21rem_minmax(0,1fr)_20rem]">
      <aside className="space-y-4">
        <section aria-label="Plant" className="rounded-sm border border-rule bg-paper-raised p-4 text-sm">
          <PlantPicker value={plantRef} onChange={choosePlant} onEdit={(item) => setEditing({ plant: { id: item.id, name: item.title, description: item.description, definition: item.definition } })} />
          <button type="button" onClick={() => setEditing({})} className="mt-2 text-xs underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
            Describe a new plant…
          </button>
          {!commissioning && currentRef?.kind === "plant" ? (
            <Link href={`/commissioning/${currentRef.plantId}`} className="ml-3 mt-2 inline-block text-xs underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
              Pre-commission this plant
            </Link>
          ) : null}
          {sensorNote ? (
            <p className="mt-2 text-xs text-ink-soft" data-testid="twin-sensor-note">
              Sensor noise from the uploaded data: {sensorNote}
            </p>
          ) : null}
          <dl className="num mt-3 grid grid-cols-[1fr_auto] gap-y-1 text-xs">
            <dt className="font-sans text-ink-soft">Time to 63 %</dt>
            <dd>{(figures.timeTo63PercentS / 60).toFixed(1)} min</dd>
            <dt className="font-sans text-ink-soft">Transmitter range</dt>
            <dd>
              {t(sensor.transmitter.rangeLowC)} – {t(sensor.transmitter.rangeHighC)}
            </dd>
            <dt className="font-sans text-ink-soft">Cutout trip</dt>
            <dd>{t(cutout.tripPointC)}</dd>
          </dl>
        </section>
        <section aria-label="Controller settings" className="rounded-sm border border-rule bg-paper-raised p-4">
          <h2 className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-faint">Controller</h2>
          <ControllerForm
            config={controller}
            units={units}
            spanC={spanC}
            onUnits={(u) => set({ units: u })}
            onApply={(cfg) => {
              setController(cfg);
              act?.act({ type: "tuning", controller: cfg });
            }}
            onRestart={restartWith}
          />
        </section>
        <section ref={panelRefs["tuning-sets"]} tabIndex={-1} aria-label="Tuning sets" className="rounded-sm border border-rule bg-paper-raised p-4 focus:outline-none focus-visible:ring-2 focus-visible:ring-rule-strong">
          <TuningSets plantRef={plantRef} current={controller} onLoad={(cfg) => loadTuning(cfg)} onSaved={(id, name) => useBench.getState().set({ savedTuningSet: { id, name } })} />
        </section>
      </aside>

      <div className="min-w-0 space-y-4">
        <TrendPanel engine={engine} />
        <LiveRunControls
          status={status}
          speed={speed}
          seed={run.seed}
          engineVersion={engineVersion}
          onRun={(s) => act?.run(s)}
          onPause={() => act?.pause()}
          onStep={() => act?.step(1)}
          onReset={() => act?.reset()}
        />
        <EndOfRunNote />
        <p className="-mt-2 text-right text-xs text-ink-faint">
          {fingerprint ? <span className="num mr-3" data-testid="trace-fingerprint">trace {fingerprint.value} · {fingerprint.rows} samples</span> : null}
          <button type="button" onClick={exportReplay} className="underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
            Export replay file
          </button>{" "}
          (re-run it with <code className="num">npm run sim -- replay FILE</code>)
        </p>
        {error ? (
          <p role="alert" className="rounded-sm border border-alarm/50 bg-alarm-soft px-3 py-2 text-sm text-alarm">
            {error}
          </p>
        ) : null}
        <ResultsTable windows={windows} unit={units.temperature} />
        <section aria-label="Saved runs" className="overflow-x-auto rounded-sm border border-rule bg-paper-raised p-4">
          <RunHistory plantRef={plantRef} currentRun={currentRun ? { title: plantTitle, ...currentRun } : null} onOpen={openSaved} onCompare={compareSaved} />
        </section>
        {experiments.state.status !== "idle" ? (
          <section aria-label="Experiment results" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4">
            <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">
              {experiments.state.kind === "saved"
                ? "Saved runs compared · each replayed from its own drill, seed and action log"
                : `Experiment · ${experiments.state.kind === "map" ? "tuning map" : experiments.state.kind === "compare" ? "PI vs PID" : "sweep"} · same proof test and seed for every run`}
            </h2>
            {experiments.state.kind === "map" && experiments.state.meta?.kcAxis && experiments.state.meta.tiAxis ? (
              <TuningMap
                rows={experiments.state.rows}
                kcAxis={experiments.state.meta.kcAxis}
                tiAxis={experiments.state.meta.tiAxis}
                metric={(experiments.state.meta.metric ?? "iae") as MapMetric}
                current={{ kc: controller.kc, ti: controller.ti }}
                onPick={(kc, ti) => loadTuning({ kc, ti })}
              />
            ) : (
              <>
                <OverlayChart rows={experiments.state.rows} />
                <ExperimentTable rows={experiments.state.rows} onLoad={(r) => loadTuning(r.controller)} />
              </>
            )}
          </section>
        ) : null}
      </div>

      <aside className="space-y-4">
        <LiveFaceplate
          unit={units.temperature}
          highAlarmC={cutout.tripPointC - 10}
          onSetpoint={onSetpoint}
          onMode={onMode}
          onManualOutput={onManualOutput}
          onCutoutReset={() => act?.act({ type: "cutout-reset" })}
        />
        <DisturbancePanel onDisturb={(a) => act?.act(a)} unit={units.temperature} ambientC={definition.kind === "enclosure" ? definition.ambientC : 20} />
        <section aria-label="Tests and experiments" className="rounded-sm border border-rule bg-paper-raised p-4">
          <div role="tablist" aria-label="Tests" className="mb-3 flex gap-4 text-sm">
            {(
              [
                ["relay", "Relay test"],
                ["bump", "Bump test"],
                ["experiments", "Experiments"],
              ] as const
            ).map(([id, label]) => (
              <button key={id} type="button" role="tab" aria-selected={testsTab === id} onClick={() => setTestsTab(id)} className={`border-b-2 pb-1 ${testsTab === id ? "border-trace-out font-semibold" : "border-transparent text-ink-soft"}`}>
                {label}
              </button>
            ))}
          </div>
          {testsTab === "experiments" ? (
            <div ref={panelRefs.proof} tabIndex={-1} className="focus:outline-none">
              <ExperimentsPanel baseDrill={drill} controller={controller} seed={run.seed} state={experiments.state} start={experiments.start} cancel={experiments.cancel} siteProofEditor={commissioning?.proofEditor(drill)} />
            </div>
          ) : null}
          {/* the test panels stay mounted (hidden) so their settings survive a tab change */}
          <div hidden={testsTab !== "relay"} ref={panelRefs.relay} tabIndex={-1} className="focus:outline-none">
            <RelayPanel units={units} spanC={spanC} controllerForm={controller.form} onStart={(o, pace) => engine?.startRelay(o, pace)} onCancel={() => engine?.cancelTest()} onApply={applyProposal("relay")} />
          </div>
          <div hidden={testsTab !== "bump"} ref={panelRefs.bump} tabIndex={-1} className="space-y-4 focus:outline-none">
            <BumpPanel units={units} spanC={spanC} controllerForm={controller.form} onStart={(o, pace) => engine?.startBump(o, pace)} onCancel={() => engine?.cancelTest()} onApply={applyProposal("bump")} />
            <div className="border-t border-rule pt-3 focus:outline-none" ref={panelRefs["power-curve"]} tabIndex={-1}>
              <PowerCurvePanel units={units} onRequest={(sp) => engine?.requestPowerCurve(sp)} />
            </div>
          </div>
        </section>
        <p className="text-xs text-ink-faint">
          Press <kbd className="num rounded-sm border border-rule-strong px-1">?</kbd> for the keyboard.
        </p>
      </aside>
      {helpOpen ? <HelpOverlay onClose={() => set({ helpOpen: false })} /> : null}
      {editing ? (
        <div className="fixed inset-0 z-40 flex items-start justify-center overflow-y-auto bg-ink/30 py-10" role="dialog" aria-modal="true" aria-label="Plant editor">
          <div className="w-full max-w-3xl rounded-sm border border-rule bg-paper-raised p-5 shadow-lg">
            <div className="mb-3 flex items-center justify-between">
              <h2 className="text-sm font-semibold">{editing.plant ? `Edit ${editing.plant.name}` : "Describe a new plant"}</h2>
              <button type="button" onClick={() => setEditing(null)} className="rounded-sm border border-rule-strong px-2 py-1 text-xs hover:border-ink">
                Close
              </button>
            </div>
            <PlantEditor
              plant={editing.plant}
              startFrom={definition}
              onSaved={(ref, def, title) => {
                setEditing(null);
                choosePlant(ref, def, title);
              }}
            />
          </div>
        </div>
      ) : null}
    </div>
  );
  if (!commissioning) return grid;
  return (
    <div className="space-y-4">
      {commissioning.header}
      {grid}
    </div>
  );
}

function LiveFaceplate(props: Omit<FaceplateProps, "snapshot">) {
  const snapshot = useBench((s) => s.snapshot);
  return <Faceplate snapshot={snapshot} {...props} />;
}

function LiveRunControls(props: Omit<Parameters<typeof RunControls>[0], "timeS">) {
  const timeS = useBench((s) => s.snapshot?.timeS ?? 0);
  return <RunControls timeS={timeS} {...props} />;
}

function EndOfRunNote() {
  const ended = useBench((s) => (s.snapshot?.timeS ?? 0) >= BENCH_DURATION_S);
  if (!ended) return null;
  return (
    <p role="status" className="text-sm text-ink-soft">
      This run has reached the Bench&apos;s {BENCH_DURATION_S / 3600} h length. Reset to start again, or export it first.
    </p>
  );
}
