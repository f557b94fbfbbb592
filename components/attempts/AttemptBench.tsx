"use client";
/**
 * The Bench in drill mode, for one trainee's scored attempt. The engine runs in the Bench's worker
 * exactly as on the Bench (BenchEngine.load(drill, starting controller, the server's seed)); the
 * drill's events play on its timeline and every operator action is stamped with its sample by the
 * worker. Only what the drill allows can be changed (sim/drill/permissions.ts), only its speeds are
 * offered, pause only if allowed, and there is no reset: the server counted the attempt when it
 * started. At the end the Bench works out its claim (attempt-claim.ts) and the trainee submits the
 * inputs; the server re-runs them and its numbers are the official ones.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { useShallow } from "zustand/react/shallow";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import { controllerViolations } from "@/sim/drill/permissions";
import { resolveCutout, resolveSensor } from "@/sim/drill/resolve";
import type { Drill } from "@/sim/drill/schema";
import type { AttemptScore } from "@/sim/drill/score";
import { temperatureToDisplay, type TemperatureUnit } from "@/sim/units";
import { TrendPanel } from "@/components/bench/TrendPanel";
import { formatElapsed } from "@/components/trend/format";
import { TableHead } from "@/components/tables/TableHead";
import { RubricPanel } from "@/components/assignments/RubricPanel";
import { ControllerForm } from "@/components/bench/ControllerForm";
import { BenchEngine } from "@/components/bench/engine-client";
import { Faceplate, FaceplateAlarms, type FaceplateProps } from "@/components/bench/Faceplate";
import { useBench } from "@/components/bench/store";
import { isArrowKey, operatorKeyAction } from "@/components/bench/operator-keys";
import { BumpPanel } from "@/components/bench/tests/BumpPanel";
import { RelayPanel } from "@/components/bench/tests/RelayPanel";
import { attemptClaimDetail, buildSubmission, lastSampleOf, submissionKeyFor, type AttemptClaim } from "./attempt-claim";
import { fieldName, initialSpeed, listOf, lockedFields, offeredSpeeds, speedLabel } from "./attempt-pace";

export interface AttemptLaunch {
  attemptId: string;
  assignmentId: string;
  assignmentTitle: string;
  /** the drill version's document, parsed output of sim/drill/schema.ts drillSchema */
  drill: Drill;
  /** issued by the server for this attempt */
  seed: number;
  attemptNumber: number;
  attemptLimit: number;
  dueAtIso: string;
  /** the cohort's IANA zone, for showing the due date */
  timeZone: string;
}

export type SubmitAttempt = (payload: string) => Promise<{ ok: true; message?: string } | { ok: false; error: string }>;

export interface AttemptBenchProps {
  launch: AttemptLaunch;
  /** the server action wrapper: receives JSON.stringify(AttemptSubmission) */
  submit: SubmitAttempt;
  /** after the server accepted the submission (the page refreshes to its "verifying" view) */
  onSubmitted?: () => void;
}

/** How long the Bench waits for the worker's trace fingerprint before claiming without it. */
const FINGERPRINT_WAIT_MS = 3000;

function isTyping(target: EventTarget | null) {
  const el = target as HTMLElement | null;
  return !!el && (el.tagName === "INPUT" || el.tagName === "SELECT" || el.tagName === "TEXTAREA" || el.isContentEditable);
}

/** The due date in the cohort's zone ("Mon 29 Mar 2027, 09:00 CEST"); UTC when the zone is unknown. */
export function formatDue(iso: string, timeZone: string): string {
  const opts: Intl.DateTimeFormatOptions = { weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZoneName: "short" };
  try {
    return new Intl.DateTimeFormat("en-GB", { ...opts, timeZone }).format(new Date(iso));
  } catch {
    return new Intl.DateTimeFormat("en-GB", { ...opts, timeZone: "UTC" }).format(new Date(iso));
  }
}


type ClaimState =
  | { status: "waiting" }
  | { status: "computing" }
  | { status: "ready"; claim: AttemptClaim; score: AttemptScore }
  | { status: "error"; message: string };

type SubmitState = { status: "idle" } | { status: "pending" } | { status: "refused"; error: string } | { status: "accepted"; message?: string };

export function AttemptBench({ launch, submit, onSubmitted }: AttemptBenchProps) {
  // the run's inputs are fixed for the life of the page: a re-render with an equal launch (a
  // router.refresh) must not reload the worker and lose the run (a new attempt remounts: key it by attemptId)
  const [{ drill, seed }] = useState(() => ({ drill: launch.drill, seed: launch.seed }));
  const may = drill.trainee.mayChange;
  const pace = drill.pace;
  const speeds = useMemo(() => offeredSpeeds(drill), [drill]);
  const engineRef = useRef<BenchEngine | null>(null);
  const [engine, setEngine] = useState<BenchEngine | null>(null);
  /** the controller at the start of the run (the trainee may change it until the run begins) */
  const [startController, setStartController] = useState<ControllerConfig>(() => controllerConfigSchema.parse(drill.referenceTuning));
  /** the controller in force (what the form shows) */
  const [controller, setController] = useState<ControllerConfig>(startController);
  const [formKey, setFormKey] = useState(0);
  const [refusal, setRefusal] = useState<string | null>(null);
  const [selectedSpeed, setSelectedSpeed] = useState<number>(() => initialSpeed(drill));
  const [testsTab, setTestsTab] = useState<"relay" | "bump">(drill.trainee.relayTestAllowed ? "relay" : "bump");

  const { status, speed, events, units, showTruth, showRaw, error, engineVersion, set } = useBench(
    useShallow((s) => ({ status: s.status, speed: s.speed, events: s.events, units: s.units, showTruth: s.showTruth, showRaw: s.showRaw, error: s.error, engineVersion: s.engineVersion, set: s.set })),
  );
  const sample = useBench((s) => s.snapshot?.sample ?? 0);
  const testRunning = useBench((s) => s.test?.status === "running");
  const fingerprint = useBench((s) => s.fingerprint);

  const sensor = useMemo(() => resolveSensor(drill), [drill]);
  const cutout = useMemo(() => resolveCutout(drill), [drill]);
  const spanC = sensor.transmitter.rangeHighC - sensor.transmitter.rangeLowC;
  const lastSample = lastSampleOf(drill, startController.sampleTimeS);
  const running = status === "running";
  const started = running || sample > 0;
  const ended = sample >= lastSample;

  // one worker per attempt page, as on the Bench
  useEffect(() => {
    const e = new BenchEngine();
    engineRef.current = e;
    setEngine(e);
    return () => e.dispose();
  }, []);

  // the run: the drill, the starting controller and the server's seed (a new starting controller before the run begins reloads it at t = 0)
  useEffect(() => {
    if (!engine) return;
    engine.load(drill, startController, seed, []);
  }, [engine, drill, startController, seed]);

  const runAt = useCallback(
    (s: number) => {
      if (!engineRef.current || ended) return;
      engineRef.current.run(s);
    },
    [ended],
  );

  /** Apply a controller configuration if the drill allows it: before the run as the new start, during it as a bumpless tuning change. */
  const applyController = (cfg: ControllerConfig): boolean => {
    const refuse = (message: string) => {
      setRefusal(message);
      setFormKey((k) => k + 1); // the form shows the settings in force again
      return false;
    };
    const bad = controllerViolations(drill, cfg);
    if (bad.length) return refuse(`Not applied: this drill does not let you change ${listOf(bad.map(fieldName))}. The form shows the settings in force.`);
    if (cfg.sampleTimeS !== controller.sampleTimeS && started) return refuse("Not applied: the sample time can change only before the run starts (a new sample time restarts the run from 0 s).");
    if (ended) return refuse("Not applied: the drill has reached its end.");
    setRefusal(null);
    setController(cfg);
    if (!started) setStartController(cfg);
    else engineRef.current?.act({ type: "tuning", controller: cfg });
    return true;
  };

  const onSetpoint = (spC: number) => may.operation && engineRef.current?.act({ type: "setpoint", setpointC: spC });
  const onMode = (mode: "auto" | "manual") => may.operation && engineRef.current?.act({ type: "mode", mode });
  const onManualOutput = (outPercent: number) => may.operation && engineRef.current?.act({ type: "manual-output", outPercent });
  const onCutoutReset = () => engineRef.current?.act({ type: "cutout-reset" });

  /** Tests run at the attempt's pace: a paused attempt starts running at the selected speed. */
  const startTest = (begin: (e: BenchEngine) => void) => {
    const e = engineRef.current;
    if (!e || ended) return;
    if (useBench.getState().status !== "running") e.run(selectedSpeed);
    begin(e);
  };

  // keyboard: only what the drill allows
  const keyState = useRef({ selectedSpeed, ended, speeds });
  keyState.current = { selectedSpeed, ended, speeds };
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isTyping(e.target) || e.ctrlKey || e.metaKey || e.altKey) return;
      const s = useBench.getState();
      const snap = s.snapshot;
      const eng = engineRef.current;
      const k = keyState.current;
      if (!eng) return;
      if (e.key === " ") {
        e.preventDefault();
        if (!pace.pauseAllowed) return; // a run without pause is started with the Run button and goes to the end
        if (s.status === "running") eng.pause();
        else if (!k.ended) eng.run(k.selectedSpeed);
      } else if (e.key === ".") {
        if (pace.pauseAllowed && s.status !== "running" && !k.ended) eng.step(1);
      } else if (e.key === "t" || e.key === "T") s.set({ showTruth: !s.showTruth });
      else if (/^[1-9]$/.test(e.key)) {
        const v = k.speeds[Number(e.key) - 1];
        if (v === undefined) return;
        setSelectedSpeed(v);
        if (s.status === "running") eng.run(v);
      } else if (may.operation && snap) {
        if (isArrowKey(e.key)) e.preventDefault();
        const action = operatorKeyAction(e, snap, s.units.temperature);
        if (action) eng.act(action);
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [pace.pauseAllowed, may.operation]);

  // at the end: ask the worker for its trace fingerprint, then work out the claim with the engine's own code
  const [claim, setClaim] = useState<ClaimState>({ status: "waiting" });
  const settled = ended && !running && !testRunning && status !== "loading";
  useEffect(() => {
    if (!settled || claim.status !== "waiting" || !engine) return;
    setClaim({ status: "computing" });
    useBench.getState().set({ fingerprint: null });
    engine.requestFingerprint();
  }, [settled, claim.status, engine]);
  useEffect(() => {
    if (claim.status !== "computing" || !engine) return;
    const compute = () => {
      const s = useBench.getState();
      try {
        const { claim: c, score } = attemptClaimDetail({
          drill,
          controller: startController,
          seed,
          actions: s.actionLog,
          trace: engine.buffer.view(),
          events: s.events,
          engineVersion: s.engineVersion,
          fingerprint: s.fingerprint,
        });
        setClaim({ status: "ready", claim: c, score });
      } catch (err) {
        setClaim({ status: "error", message: err instanceof Error ? err.message : String(err) });
      }
    };
    // a frame first, so "working out" shows before the reference run occupies the main thread
    const id = setTimeout(compute, fingerprint ? 0 : FINGERPRINT_WAIT_MS);
    return () => clearTimeout(id);
  }, [claim.status, fingerprint, engine, drill, startController, seed]);

  const [submitState, setSubmitState] = useState<SubmitState>({ status: "idle" });
  const pendingRef = useRef(false);
  const doSubmit = async () => {
    if (claim.status !== "ready" || pendingRef.current || submitState.status === "accepted") return;
    const built = buildSubmission({
      attemptId: launch.attemptId,
      submissionKey: submissionKeyFor(launch.attemptId),
      controller: startController,
      actionLog: useBench.getState().actionLog,
      claim: claim.claim,
    });
    if (!built.ok) return setSubmitState({ status: "refused", error: built.error });
    pendingRef.current = true;
    setSubmitState({ status: "pending" });
    try {
      const r = await submit(built.payload);
      if (r.ok) {
        setSubmitState({ status: "accepted", message: r.message });
        onSubmitted?.();
      } else setSubmitState({ status: "refused", error: r.error });
    } catch (err) {
      setSubmitState({ status: "refused", error: `The submission did not reach the server (${err instanceof Error ? err.message : String(err)}). Try again: the same submission is sent.` });
    } finally {
      pendingRef.current = false;
    }
  };

  const t = (c: number) => `${temperatureToDisplay(c, units.temperature).toFixed(1)} °${units.temperature}`;
  const locked = useMemo(() => lockedFields(drill, controller, started), [drill, controller, started]);
  const showTests = drill.trainee.relayTestAllowed || drill.trainee.bumpTestAllowed;

  return (
    <div data-testid="attempt-bench" className="space-y-4">
      <header className="flex flex-wrap items-baseline gap-x-6 gap-y-1 border-b border-rule pb-3">
        <h1 className="text-lg font-semibold">{launch.assignmentTitle}</h1>
        <p className="text-sm text-ink-soft">
          Attempt <span className="num">{launch.attemptNumber}</span> of <span className="num">{launch.attemptLimit}</span>
        </p>
        <p className="text-sm text-ink-soft">
          Due <time dateTime={launch.dueAtIso} className="num" data-testid="attempt-due">{formatDue(launch.dueAtIso, launch.timeZone)}</time>
        </p>
        <p className="text-sm text-ink-faint">
          Drill: {drill.title} · revision <span className="num">{drill.revision}</span>
        </p>
        <p className="w-full text-xs text-ink-soft">
          <strong className="font-medium text-caution">Training simulator.</strong> A scored attempt: it runs once to the end of the drill and cannot be reset; the server re-runs it to verify your result.
        </p>
      </header>

      <div className="grid gap-4 xl:grid-cols-[21rem_minmax(0,1fr)_20rem]">
        <aside className="space-y-4">
          <RubricPanel drill={drill} speeds={speeds} />
          {drill.description ? <p className="rounded-sm border border-rule bg-paper-raised p-4 text-sm text-ink-soft">{drill.description}</p> : null}
          <section aria-label="Controller settings" className="rounded-sm border border-rule bg-paper-raised p-4">
            <h2 className="mb-2 text-xs font-semibold uppercase tracking-wide text-ink-faint">Controller</h2>
            <ControllerForm
              key={formKey}
              config={controller}
              units={units}
              spanC={spanC}
              locked={locked}
              onUnits={(u) => set({ units: u })}
              onApply={applyController}
              onRestart={applyController}
            />
            <ul className="mt-2 space-y-0.5 text-[11px] leading-snug text-ink-faint" data-testid="attempt-locks">
              <li>{started ? "The run has begun: tuning changes apply bumplessly and are logged with their sample." : "Before the run: changes set the controller the run starts with."}</li>
              <li>PV filter: {may.pvFilter ? "yours to set." : "fixed by this drill."}</li>
              <li>Sample time: {!may.sampleTime ? "fixed by this drill." : started ? "fixed now: it can change only before the run starts." : "yours to set before the run starts (a change restarts the run at 0 s)."}</li>
              <li>Other settings (action, limits, bad-PV policy) are fixed by this drill.</li>
            </ul>
            {refusal ? (
              <p role="alert" className="mt-2 rounded-sm border border-alarm/50 bg-alarm-soft px-2 py-1.5 text-xs text-alarm">
                {refusal}
              </p>
            ) : null}
          </section>
        </aside>

        <div className="min-w-0 space-y-4">
          <TrendPanel engine={engine} />
          <AttemptRunControls
            status={status}
            workerSpeed={speed}
            selectedSpeed={selectedSpeed}
            speeds={speeds}
            pauseAllowed={pace.pauseAllowed}
            ended={ended}
            durationS={drill.durationS}
            seed={seed}
            engineVersion={engineVersion}
            onSelectSpeed={(s) => {
              setSelectedSpeed(s);
              if (running) runAt(s);
            }}
            onRun={() => runAt(selectedSpeed)}
            onPause={() => pace.pauseAllowed && engineRef.current?.pause()}
            onStep={() => pace.pauseAllowed && !ended && engineRef.current?.step(1)}
          />
          {error ? (
            <p role="alert" className="rounded-sm border border-alarm/50 bg-alarm-soft px-3 py-2 text-sm text-alarm">
              {error}
            </p>
          ) : null}
          <ClaimPanel claim={claim} ended={ended} durationS={drill.durationS} submitState={submitState} onSubmit={doSubmit} />
        </div>

        <aside className="space-y-4">
          {may.operation ? (
            <LiveFaceplate unit={units.temperature} highAlarmC={cutout.tripPointC - 10} onSetpoint={onSetpoint} onMode={onMode} onManualOutput={onManualOutput} onCutoutReset={onCutoutReset} />
          ) : (
            <ReadOnlyFaceplate unit={units.temperature} highAlarmC={cutout.tripPointC - 10} onCutoutReset={onCutoutReset} />
          )}
          <dl className="num grid grid-cols-[1fr_auto] gap-y-1 rounded-sm border border-rule bg-paper-raised p-4 text-xs">
            <dt className="font-sans text-ink-soft">Transmitter range</dt>
            <dd>
              {t(sensor.transmitter.rangeLowC)} – {t(sensor.transmitter.rangeHighC)}
            </dd>
            <dt className="font-sans text-ink-soft">Cutout trip</dt>
            <dd>{t(cutout.tripPointC)}</dd>
          </dl>
          {showTests ? (
            <section aria-label="Tests" className="rounded-sm border border-rule bg-paper-raised p-4">
              <div role="tablist" aria-label="Tests" className="mb-3 flex gap-4 text-sm">
                {(
                  [
                    ["relay", "Relay test", drill.trainee.relayTestAllowed],
                    ["bump", "Bump test", drill.trainee.bumpTestAllowed],
                  ] as const
                )
                  .filter(([, , allowed]) => allowed)
                  .map(([id, label]) => (
                    <button key={id} type="button" role="tab" aria-selected={testsTab === id} onClick={() => setTestsTab(id)} className={`border-b-2 pb-1 ${testsTab === id ? "border-trace-out font-semibold" : "border-transparent text-ink-soft"}`}>
                      {label}
                    </button>
                  ))}
              </div>
              {drill.trainee.relayTestAllowed ? (
                <div hidden={testsTab !== "relay"}>
                  <RelayPanel units={units} spanC={spanC} controllerForm={controller.form} onStart={(o) => startTest((e) => e.startRelay(o, "bench"))} onCancel={() => engineRef.current?.cancelTest()} onApply={applyController} />
                </div>
              ) : null}
              {drill.trainee.bumpTestAllowed ? (
                <div hidden={testsTab !== "bump"}>
                  <BumpPanel units={units} spanC={spanC} controllerForm={controller.form} onStart={(o) => startTest((e) => e.startBump(o, "bench"))} onCancel={() => engineRef.current?.cancelTest()} onApply={applyController} />
                </div>
              ) : null}
              <p className="mt-3 text-[11px] text-ink-faint">In an attempt a test runs at the attempt&apos;s speed, on the loop as it is; its actions are logged like yours.</p>
            </section>
          ) : null}
          <KeyboardNote operation={may.operation} pauseAllowed={pace.pauseAllowed} speeds={speeds} />
        </aside>
      </div>
    </div>
  );
}

function AttemptRunControls(p: {
  status: "loading" | "paused" | "running";
  workerSpeed: number | "max";
  selectedSpeed: number;
  speeds: number[];
  pauseAllowed: boolean;
  ended: boolean;
  durationS: number;
  seed: number;
  engineVersion: string;
  onSelectSpeed: (s: number) => void;
  onRun: () => void;
  onPause: () => void;
  onStep: () => void;
}) {
  const timeS = useBench((s) => s.snapshot?.timeS ?? 0);
  const running = p.status === "running";
  const current = running && typeof p.workerSpeed === "number" ? p.workerSpeed : p.selectedSpeed;
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-sm border border-rule bg-paper-raised px-4 py-2.5 text-sm" role="toolbar" aria-label="Run controls">
      {running && p.pauseAllowed ? (
        <button type="button" onClick={p.onPause} className="w-20 rounded-sm bg-ink px-3 py-1.5 font-semibold text-paper" aria-keyshortcuts="Space">
          Pause
        </button>
      ) : (
        <button
          type="button"
          onClick={p.onRun}
          disabled={p.status === "loading" || running || p.ended}
          className="w-20 rounded-sm bg-ink px-3 py-1.5 font-semibold text-paper disabled:opacity-50"
          aria-keyshortcuts={p.pauseAllowed ? "Space" : undefined}
        >
          {running ? "Running" : "Run"}
        </button>
      )}
      {p.pauseAllowed ? (
        <button type="button" onClick={p.onStep} disabled={running || p.ended || p.status === "loading"} className="rounded-sm border border-rule-strong px-2.5 py-1.5 hover:border-ink disabled:opacity-40" aria-keyshortcuts=".">
          Step
        </button>
      ) : null}
      <span className="flex gap-1" role="group" aria-label="Speed">
        {p.speeds.map((s) => (
          <button
            key={s}
            type="button"
            aria-pressed={current === s}
            onClick={() => p.onSelectSpeed(s)}
            className={`num rounded-sm border px-2 py-1 ${current === s ? "border-ink bg-ink text-paper" : "border-rule-strong hover:border-ink"}`}
          >
            {speedLabel(s)}
          </button>
        ))}
      </span>
      <span className="num ml-auto text-ink-soft" data-testid="sim-time">
        sim {formatElapsed(timeS)} of {formatElapsed(p.durationS)} · seed {p.seed} · engine {p.engineVersion || "…"}
      </span>
    </div>
  );
}

function ClaimPanel({ claim, ended, durationS, submitState, onSubmit }: { claim: ClaimState; ended: boolean; durationS: number; submitState: SubmitState; onSubmit: () => void }) {
  if (!ended) {
    return (
      <section aria-label="Submission" className="rounded-sm border border-rule bg-paper-raised p-4 text-sm text-ink-soft">
        The attempt runs to <span className="num">{formatElapsed(durationS)}</span>. At the end your Bench works out its score and you submit the attempt.
      </section>
    );
  }
  const pending = submitState.status === "pending";
  const accepted = submitState.status === "accepted";
  return (
    <section aria-label="Submission" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4 text-sm">
      <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">End of the drill</h2>
      {claim.status === "waiting" || claim.status === "computing" ? (
        <p role="status" className="text-ink-soft">
          Working out your Bench&apos;s score…
        </p>
      ) : claim.status === "error" ? (
        <p role="alert" className="text-alarm">
          Your Bench could not work out a score: {claim.message}
        </p>
      ) : (
        <>
          <div data-testid="attempt-claimed-score">
            <p>
              <span className="num text-3xl font-medium">{claim.claim.score.toFixed(1)}</span> <span className="num text-ink-soft">/ 100</span>
            </p>
            <p className="text-xs text-ink-soft">your Bench&apos;s score — the server re-runs the attempt to verify it</p>
          </div>
          <table className="w-full border-collapse text-xs">
            <TableHead columns={["window", "weight", "score"]} />
            <tbody className="num">
              {claim.score.windows.map((w, i) => (
                <tr key={w.id} className="border-b border-rule">
                  <td className="py-1 font-sans">{claim.claim.results.windows[i]?.label ?? w.id}</td>
                  <td className="py-1">{w.weight}</td>
                  <td className="py-1">{w.score.toFixed(1)} / 100</td>
                </tr>
              ))}
            </tbody>
          </table>
          {claim.score.safetyTrips ? (
            <p className="text-xs text-caution">
              <span className="num">{claim.score.safetyTrips}</span> cutout trip{claim.score.safetyTrips === 1 ? "" : "s"}: the total is multiplied by the penalty for each.
            </p>
          ) : null}
          <button
            type="button"
            data-testid="attempt-submit"
            onClick={onSubmit}
            disabled={pending || accepted}
            className="rounded-sm bg-ink px-4 py-2 font-semibold text-paper hover:bg-ink-soft disabled:opacity-50"
          >
            {pending ? "Submitting…" : accepted ? "Submitted" : "Submit attempt"}
          </button>
          {submitState.status === "refused" ? (
            <p role="alert" className="rounded-sm border border-alarm/50 bg-alarm-soft px-3 py-2 text-alarm">
              {submitState.error}
            </p>
          ) : null}
          {accepted ? (
            <p role="status" className="text-ok">
              {submitState.message ?? "Submitted: the server is re-running your attempt to verify it."}
            </p>
          ) : null}
        </>
      )}
    </section>
  );
}

function LiveFaceplate(props: Omit<FaceplateProps, "snapshot">) {
  const snapshot = useBench((s) => s.snapshot);
  return <Faceplate snapshot={snapshot} {...props} />;
}

const fmt = (v: number | undefined, digits: number) => (v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(digits));

/** The faceplate when the drill does not let the trainee operate the loop: readouts and alarms, no entries (the cutout reset stays). */
function ReadOnlyFaceplate({ unit, highAlarmC, onCutoutReset }: { unit: TemperatureUnit; highAlarmC: number; onCutoutReset: () => void }) {
  const snapshot = useBench((s) => s.snapshot);
  const badPv = snapshot?.pvBad ?? false;
  const tripped = snapshot?.cutoutTripped ?? false;
  const highPv = snapshot ? snapshot.pvFilteredC > highAlarmC : false;
  return (
    <section aria-label="Faceplate" className="rounded-sm border border-rule bg-paper-raised p-4" data-testid="faceplate-readonly">
      <p className="text-xs text-ink-faint">Loop · enclosure air temperature · read-only in this drill</p>
      <div className="mt-1 flex items-baseline gap-2">
        <output className={`num text-5xl font-medium leading-none ${badPv ? "text-alarm" : ""}`} data-testid="pv-readout" aria-label="PV">
          {badPv ? "BAD" : fmt(snapshot ? temperatureToDisplay(snapshot.pvFilteredC, unit) : undefined, 1)}
        </output>
        <span className="text-sm text-ink-soft">°{unit} PV</span>
      </div>
      <dl className="mt-4 grid grid-cols-[3rem_1fr] items-center gap-x-3 gap-y-2 text-sm">
        <dt className="text-ink-soft">SP</dt>
        <dd className="num" data-testid="sp-readout">
          {fmt(snapshot ? temperatureToDisplay(snapshot.setpointC, unit) : undefined, 1)} °{unit}
        </dd>
        <dt className="text-ink-soft">OUT</dt>
        <dd>
          <div className="relative h-5 overflow-hidden rounded-sm border border-rule-strong bg-paper" aria-hidden="true">
            <div className="absolute inset-y-0 left-0 bg-trace-out/80" style={{ width: `${Math.min(100, Math.max(0, snapshot?.outPercent ?? 0))}%` }} />
          </div>
          <span className="num" data-testid="out-readout">
            {fmt(snapshot?.outPercent, 1)} %
          </span>
        </dd>
        <dt className="text-ink-soft">Mode</dt>
        <dd data-testid="mode-readout">{snapshot?.mode === "manual" ? "manual" : "auto"}</dd>
      </dl>
      <p className="mt-2 text-[11px] text-ink-faint">This drill does not let you operate the loop: SP, mode and OUT follow the drill&apos;s timeline.</p>
      <FaceplateAlarms highPv={highPv} badPv={badPv} tripped={tripped} onCutoutReset={onCutoutReset} />
    </section>
  );
}

function KeyboardNote({ operation, pauseAllowed, speeds }: { operation: boolean; pauseAllowed: boolean; speeds: number[] }) {
  const keys: [string, string][] = [];
  if (pauseAllowed) keys.push(["Space", "run / pause"], [".", "one sample step (paused)"]);
  if (operation) keys.push(["A", "auto / manual"], ["↑ / ↓", "SP"], ["Shift + ↑ / ↓", "manual OUT"]);
  keys.push([`1 – ${Math.min(9, speeds.length)}`, "speed"], ["T", "true temperature"]);
  return (
    <p className="text-xs leading-relaxed text-ink-faint" data-testid="attempt-keys">
      Keyboard:{" "}
      {keys.map(([k, v], i) => (
        <span key={k}>
          {i ? " · " : ""}
          <kbd className="num rounded-sm border border-rule-strong px-1">{k}</kbd> {v}
        </span>
      ))}
    </p>
  );
}

/** A trace's key beside the trend (as on the Bench). */
