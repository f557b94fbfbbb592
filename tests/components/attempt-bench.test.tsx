// The Bench in drill mode for a scored attempt, with the engine worker replaced by a stand-in that
// records the commands and streams a real run (BenchSession, the worker's own stepping) when asked:
// the rubric is shown before the run, only what the drill allows is offered (operation, relay and
// bump tests, speeds, pause), a disallowed setting is refused, and the submission parses with the
// contract (app/_lib/classroom/contracts.ts) and keeps its key across retries.
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";

vi.mock("uplot", () => ({ default: class { destroy() {} } }));
vi.mock("@/components/trend/Trend", () => ({ Trend: () => <div data-testid="trend-stub" /> }));

const engines = vi.hoisted(() => [] as unknown[]);
vi.mock("@/components/bench/engine-client", async () => {
  const { TraceBuffer } = await import("@/components/bench/trace-buffer");
  const { useBench } = await import("@/components/bench/store");
  class FakeEngine {
    buffer = new TraceBuffer();
    calls: { name: string; args: unknown[] }[] = [];
    fingerprint: { rows: number; value: string } | null = null;
    constructor() {
      engines.push(this);
    }
    private record(name: string, args: unknown[]) {
      this.calls.push({ name, args });
    }
    load(...args: unknown[]) {
      this.record("load", args);
      this.buffer.clear();
      const snapshot = { sample: 0, timeS: 0, setpointC: 59.3, pvRawC: 59, pvFilteredC: 59, trueC: 59, outPercent: 25, mode: "auto" as const, pvBad: false, cutoutTripped: false };
      useBench.getState().set({ status: "paused", engineVersion: "1.0.0", snapshot, events: [], actionLog: [], fingerprint: null, test: null });
    }
    run(...args: unknown[]) {
      this.record("run", args);
      useBench.getState().set({ status: "running", speed: args[0] as number });
    }
    pause() {
      this.record("pause", []);
      useBench.getState().set({ status: "paused" });
    }
    step(...args: unknown[]) {
      this.record("step", args);
    }
    act(...args: unknown[]) {
      this.record("act", args);
    }
    requestFingerprint() {
      this.record("requestFingerprint", []);
      if (this.fingerprint) useBench.getState().set({ fingerprint: this.fingerprint });
    }
    reset() {
      this.record("reset", []);
    }
    startRelay(...args: unknown[]) {
      this.record("startRelay", args);
    }
    startBump(...args: unknown[]) {
      this.record("startBump", args);
    }
    cancelTest() {
      this.record("cancelTest", []);
    }
    requestPowerCurve() {}
    dispose() {}
  }
  return { BenchEngine: FakeEngine };
});

import ladder from "@/sim/examples/setpoint-ladder.json";
import { attemptSubmissionSchema } from "@/app/_lib/classroom/contracts";
import { AttemptBench, type AttemptLaunch } from "@/components/attempts/AttemptBench";
import { SUBMISSION_KEY_PREFIX } from "@/components/attempts/attempt-claim";
import { useBench, type BenchState } from "@/components/bench/store";
import type { TraceBuffer } from "@/components/bench/trace-buffer";
import { controllerConfigSchema } from "@/sim/control/config";
import { runDrill } from "@/sim/drill/run-drill";
import { drillSchema, type DrillInput } from "@/sim/drill/schema";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import { BenchSession } from "@/sim/worker/bench-session";

interface Fake {
  buffer: TraceBuffer;
  calls: { name: string; args: unknown[] }[];
  fingerprint: { rows: number; value: string } | null;
}

const SEED = 3141;
const ATTEMPT_ID = "0b7d5c3e-6a21-4f0e-9c55-2d1b8e4f7a10";
const base = ladder as unknown as DrillInput;

/** The cure ladder's first step (10 min) with the rules patched per test. */
function drillWith(patch: { trainee?: DrillInput["trainee"]; pace?: DrillInput["pace"] } = {}) {
  return drillSchema.parse({
    ...base,
    id: "ladder-first-step",
    events: [{ type: "setpoint", timeS: 300, setpointC: 80 }],
    scoring: { ...base.scoring, windows: [{ id: "step-80", label: "60 → 80 °C", kind: "setpoint", startS: 300, endS: 600, weight: 2 }] },
    durationS: 600,
    trainee: patch.trainee ?? base.trainee,
    pace: patch.pace ?? base.pace,
  });
}

function launchOf(drill = drillWith()): AttemptLaunch {
  return { attemptId: ATTEMPT_ID, assignmentId: "a5d1c7f2-1111-4222-8333-444455556666", assignmentTitle: "Week 3: cure ladder", drill, seed: SEED, attemptNumber: 2, attemptLimit: 3, dueAtIso: "2027-03-29T07:00:00.000Z", timeZone: "Europe/Berlin" };
}

const engine = () => engines[engines.length - 1] as Fake;
const calls = (name: string) => engine().calls.filter((c) => c.name === name);

/** What the worker streams for the whole drill: a real session, its rows in the buffer, its last snapshot in the store. */
function finishRun(drill: ReturnType<typeof drillWith>) {
  const session = new BenchSession(drill, controllerConfigSchema.parse(drill.referenceTuning), SEED);
  session.stepSamples(1);
  const e = engine();
  const first = session.takeChunk()!;
  e.buffer.append(first.from, first.trace);
  session.stepSamples(1e6);
  const rest = session.takeChunk()!;
  e.buffer.append(rest.from, rest.trace);
  const trace = session.simulation.trace();
  e.fingerprint = { rows: trace.length, value: traceFingerprint(trace) };
  act(() => useBench.getState().set({ status: "paused", snapshot: rest.snapshot, events: [...first.events, ...rest.events], actionLog: [...first.actions, ...rest.actions] }));
}

let initial: BenchState;
beforeAll(() => {
  initial = useBench.getState();
});
beforeEach(() => {
  useBench.setState(initial, true);
  sessionStorage.clear();
});
afterEach(() => {
  engines.length = 0;
});

const noSubmit = async () => ({ ok: true as const });

describe("AttemptBench", () => {
  it("shows the assignment, the attempt count, the due date in the cohort's zone and the rubric before the run", () => {
    render(<AttemptBench launch={launchOf()} submit={noSubmit} />);
    const root = screen.getByTestId("attempt-bench");
    expect(root.textContent).toMatch(/Week 3: cure ladder/);
    expect(root.textContent).toMatch(/Attempt 2 of 3/);
    // 07:00 UTC on 29 March 2027 is 09:00 in Berlin (CEST, UTC+2 after the last Sunday of March — EU summer time rule)
    expect(screen.getByTestId("attempt-due").textContent).toMatch(/29 Mar 2027, 09:00/);
    const rubric = screen.getByTestId("attempt-rubric");
    expect(rubric.textContent).toMatch(/window score = 100\/\(1 \+ C\)/);
    const row = within(screen.getByTestId("attempt-rubric-windows")).getByText("60 → 80 °C").closest("tr")!;
    expect(row.textContent).toMatch(/setpoint/);
    expect(row.textContent).toMatch(/5–10 min/);
    // one window: its weight (2) is the whole score, shown as a share
    expect(row.textContent).toMatch(/100 %$/);
    // metric weights 0.5 / 0.25 / 0.25 (the schema defaults) shown as shares of 100 %
    expect(rubric.textContent).toMatch(/IAE50 %/);
    expect(screen.getByTestId("attempt-rubric-pace").textContent).toMatch(/×1, ×10, ×60, ×600/);
    expect(screen.getByTestId("attempt-rubric-pace").textContent).toMatch(/You may pause/);
    // no Bench-only panels in a scored attempt
    expect(screen.queryByRole("button", { name: "Reset" })).toBeNull();
    expect(screen.queryByText(/Experiments/)).toBeNull();
    expect(screen.queryByText(/Saved runs/)).toBeNull();
    expect(screen.queryByRole("region", { name: "Disturbances" })).toBeNull();
    expect(screen.queryByRole("button", { name: /hand in/i })).toBeNull();
  });

  it("loads the drill with the reference tuning and the server's seed in the Bench worker", () => {
    const drill = drillWith();
    const { rerender } = render(<AttemptBench launch={launchOf(drill)} submit={noSubmit} />);
    const [d, cfg, seed, actions] = calls("load")[0].args;
    expect(d).toBe(drill);
    expect(cfg).toEqual(controllerConfigSchema.parse(drill.referenceTuning));
    expect(seed).toBe(SEED);
    expect(actions).toEqual([]);
    // the page re-rendering with an equal launch (a router.refresh) does not restart the run
    rerender(<AttemptBench launch={launchOf(drillWith())} submit={noSubmit} />);
    expect(calls("load")).toHaveLength(1);
  });

  it("shows a read-only faceplate when the drill does not allow operating the loop, and the entries when it does", () => {
    const { unmount } = render(<AttemptBench launch={launchOf(drillWith({ trainee: { ...base.trainee, mayChange: { ...base.trainee!.mayChange, operation: false } } }))} submit={noSubmit} />);
    expect(screen.queryByTestId("sp-input")).toBeNull();
    expect(screen.queryByTestId("out-input")).toBeNull();
    expect(screen.queryByRole("button", { name: "Manual" })).toBeNull();
    expect(screen.getByTestId("sp-readout").textContent).toMatch(/59\.3 °C/);
    // the arrow keys do not move SP either
    fireEvent.keyDown(window, { key: "ArrowUp" });
    fireEvent.keyDown(window, { key: "a" });
    expect(calls("act")).toHaveLength(0);
    unmount();
    render(<AttemptBench launch={launchOf(drillWith({ trainee: { ...base.trainee, mayChange: { ...base.trainee!.mayChange, operation: true } } }))} submit={noSubmit} />);
    expect(screen.getByTestId("sp-input")).toBeTruthy();
    fireEvent.keyDown(window, { key: "ArrowUp" });
    expect(calls("act")[0].args[0]).toEqual({ type: "setpoint", setpointC: 59.8 });
  });

  it("offers only the tests the drill allows", () => {
    const { unmount } = render(<AttemptBench launch={launchOf(drillWith({ trainee: { ...base.trainee, relayTestAllowed: false, bumpTestAllowed: true } }))} submit={noSubmit} />);
    expect(screen.queryByRole("tab", { name: "Relay test" })).toBeNull();
    expect(screen.queryByTestId("relay-panel")).toBeNull();
    expect(screen.getByRole("tab", { name: "Bump test" })).toBeTruthy();
    unmount();
    render(<AttemptBench launch={launchOf(drillWith({ trainee: { ...base.trainee, relayTestAllowed: false, bumpTestAllowed: false } }))} submit={noSubmit} />);
    expect(screen.queryByRole("tablist", { name: "Tests" })).toBeNull();
  });

  it("offers only the drill's speeds and runs at the one chosen", () => {
    render(<AttemptBench launch={launchOf(drillWith({ pace: { speeds: [60, 10], pauseAllowed: true } }))} submit={noSubmit} />);
    const group = screen.getByRole("group", { name: "Speed" });
    expect(within(group).getAllByRole("button").map((b) => b.textContent)).toEqual(["×10", "×60"]);
    fireEvent.click(within(group).getByRole("button", { name: "×10" }));
    expect(calls("run")).toHaveLength(0); // choosing a speed while paused does not start the run
    fireEvent.click(screen.getByRole("button", { name: "Run" }));
    expect(calls("run")[0].args).toEqual([10]);
    expect(screen.getByRole("button", { name: "Pause" })).toBeTruthy();
    expect(screen.getByRole("button", { name: "Step" })).toBeTruthy();
    fireEvent.keyDown(window, { key: " " });
    expect(calls("pause")).toHaveLength(1);
  });

  it("without pause: no pause, no step, and the space key does nothing", () => {
    render(<AttemptBench launch={launchOf(drillWith({ pace: { speeds: [10, 60], pauseAllowed: false } }))} submit={noSubmit} />);
    expect(screen.queryByRole("button", { name: "Step" })).toBeNull();
    fireEvent.keyDown(window, { key: " " });
    expect(calls("run")).toHaveLength(0);
    fireEvent.click(screen.getByRole("button", { name: "Run" }));
    expect(calls("run")).toHaveLength(1);
    expect(screen.queryByRole("button", { name: "Pause" })).toBeNull();
    expect((screen.getByRole("button", { name: "Running" }) as HTMLButtonElement).disabled).toBe(true);
    fireEvent.keyDown(window, { key: " " });
    fireEvent.keyDown(window, { key: "." });
    expect(calls("pause")).toHaveLength(0);
    expect(calls("step")).toHaveLength(0);
    expect(screen.getByTestId("attempt-rubric-pace").textContent).toMatch(/No pause/);
  });

  it("sets the starting controller before the run, applies tuning bumplessly during it, and refuses settings the drill fixes", () => {
    const drill = drillWith({ trainee: { ...base.trainee, mayChange: { tuning: true, pvFilter: false, sampleTime: true } } });
    render(<AttemptBench launch={launchOf(drill)} submit={noSubmit} />);
    expect((screen.getByLabelText("PV filter τf") as HTMLInputElement).disabled).toBe(true);
    expect((screen.getByLabelText("OUT high limit") as HTMLInputElement).disabled).toBe(true);
    expect((screen.getByLabelText("Sample time") as HTMLInputElement).disabled).toBe(false);
    // before the run: a new Kc is the run's starting controller (the run reloads at 0 s)
    fireEvent.change(screen.getByLabelText("Gain Kc"), { target: { value: "4.5" } });
    fireEvent.click(screen.getByRole("button", { name: "Apply tuning (bumpless)" }));
    expect(calls("load")).toHaveLength(2);
    expect((calls("load")[1].args[1] as { kc: number }).kc).toBe(4.5);
    expect(calls("act")).toHaveLength(0);
    // a setting outside the rules is refused, nothing applied
    fireEvent.change(screen.getByLabelText("Action"), { target: { value: "direct" } });
    fireEvent.click(screen.getByRole("button", { name: "Apply tuning (bumpless)" }));
    expect(screen.getByRole("alert").textContent).toMatch(/does not let you change the action/);
    expect(calls("load")).toHaveLength(2);
    expect((screen.getByLabelText("Action") as HTMLSelectElement).value).toBe("reverse");
    // once running: tuning is a logged action; the sample time is locked with its reason
    fireEvent.click(screen.getByRole("button", { name: "Run" }));
    expect((screen.getByLabelText("Sample time") as HTMLInputElement).disabled).toBe(true);
    expect(screen.getByTestId("attempt-locks").textContent).toMatch(/can change only before the run starts/);
    fireEvent.change(screen.getByLabelText("Gain Kc"), { target: { value: "5" } });
    fireEvent.click(screen.getByRole("button", { name: "Apply tuning (bumpless)" }));
    expect(calls("act")[0].args[0]).toMatchObject({ type: "tuning", controller: { kc: 5, ti: 400 } });
    expect(calls("load")).toHaveLength(2);
  });

  it("at the end claims the engine's score and submits a payload that parses, reusing its submission key on a retry", async () => {
    const drill = drillWith();
    const submit = vi.fn<(payload: string) => Promise<{ ok: true; message?: string } | { ok: false; error: string }>>();
    submit.mockResolvedValueOnce({ ok: false, error: "The server is busy; try again." });
    let release!: (v: { ok: true }) => void;
    submit.mockImplementationOnce(() => new Promise((r) => (release = r)));
    const onSubmitted = vi.fn();
    render(<AttemptBench launch={launchOf(drill)} submit={submit} onSubmitted={onSubmitted} />);
    expect(screen.queryByTestId("attempt-submit")).toBeNull();
    finishRun(drill);
    const claimed = await screen.findByTestId("attempt-claimed-score");
    expect(calls("requestFingerprint")).toHaveLength(1);
    const official = runDrill(drill, drill.referenceTuning, [], SEED, { score: true });
    expect(official.score!.score).toBe(50); // the reference tuning against itself (sim/drill/score.ts)
    expect(claimed.textContent).toMatch(/50\.0/);
    expect(claimed.textContent).toMatch(/your Bench's score — the server re-runs the attempt to verify it/);
    expect((screen.getByRole("button", { name: "Run" }) as HTMLButtonElement).disabled).toBe(true);

    const button = screen.getByTestId("attempt-submit");
    await act(async () => fireEvent.click(button));
    expect(screen.getByRole("alert").textContent).toMatch(/The server is busy/);
    expect(onSubmitted).not.toHaveBeenCalled();
    const first = attemptSubmissionSchema.parse(JSON.parse(submit.mock.calls[0][0]));
    expect(first.attemptId).toBe(ATTEMPT_ID);
    expect(first.controller).toEqual(controllerConfigSchema.parse(drill.referenceTuning));
    expect(first.actionLog).toEqual([]);
    expect(first.claimed.score).toBe(50);
    expect(first.claimed.fingerprint).toBe(traceFingerprint(official.trace));
    expect(sessionStorage.getItem(SUBMISSION_KEY_PREFIX + ATTEMPT_ID)).toBe(first.submissionKey);

    fireEvent.click(button);
    expect((button as HTMLButtonElement).disabled).toBe(true); // pending
    fireEvent.click(button);
    expect(submit).toHaveBeenCalledTimes(2);
    await act(async () => release({ ok: true }));
    await waitFor(() => expect(onSubmitted).toHaveBeenCalledTimes(1));
    const second = attemptSubmissionSchema.parse(JSON.parse(submit.mock.calls[1][0]));
    expect(second.submissionKey).toBe(first.submissionKey);
    expect(second.claimed).toEqual(first.claimed);
  });
});
