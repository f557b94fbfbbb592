// The hand-over path on the Bench's state: each stage's status follows what the Bench computed
// and recorded (power curve from the engine, a relay result delivered through the engine client,
// the rule applied through the relay panel, a site proof test built in the editor and compared
// PI vs PID by the engine), and "Write tuning record" sends a request that parses with the
// record's own schema and carries the proof tests exactly as they were run.
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import type { ReactNode } from "react";
import { SWRConfig } from "swr";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { RecordActionResult } from "@/app/(app)/records/actions";
import { recordRequestSchema } from "@/app/_lib/records/record-document";
import type { TuningSetItem } from "@/db/bench-queries";
import { BENCH_START_TUNING, benchDrill } from "@/components/bench/bench-drill";
import { BenchEngine } from "@/components/bench/engine-client";
import { ExperimentsPanel } from "@/components/bench/experiments/ExperimentsPanel";
import { proofRunsOf } from "@/components/bench/experiments/proof-runs";
import type { ExperimentState } from "@/components/bench/experiments/use-experiments";
import { NO_FINDINGS, useBench } from "@/components/bench/store";
import { RelayPanel } from "@/components/bench/tests/RelayPanel";
import { HandoverPath } from "@/components/commissioning/HandoverPath";
import { ProofTestBuilder } from "@/components/commissioning/ProofTestBuilder";
import { controllerConfigSchema } from "@/sim/control/config";
import { drillSchema } from "@/sim/drill/schema";
import { runJobs, jobsFor } from "@/sim/experiments/variants";
import { piVersusPidVariants } from "@/sim/experiments/sweep";
import { findPreset } from "@/sim/plant/presets";
import { starterDocument } from "@/components/drills/starters";
import { outputForSetpoint, powerCurve, staticGainAt, heatUpTime } from "@/sim/tuning/power-curve";
import { BenchSession } from "@/sim/worker/bench-session";
import { BenchTests } from "@/sim/worker/bench-tests";
import type { FromWorker } from "@/sim/worker/protocol";

const RECORD_ID = "5f0c2a61-1d3b-4c7e-9a2f-6b8d0e4c1a77";
const SET_ID = "9d3e2f1a-0b4c-4e5d-8a6f-7b8c9d0e1f2a";
const PLANT_ID = "0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11";
const plantRef = `plant:${PLANT_ID}`;
const SEED = 20261201;

const { createTuningRecord, push } = vi.hoisted(() => ({
  createTuningRecord: vi.fn(async (_prev: unknown, _form: FormData): Promise<RecordActionResult> => ({ ok: true, message: "Tuning record written.", id: "5f0c2a61-1d3b-4c7e-9a2f-6b8d0e4c1a77" })),
  push: vi.fn(),
}));
vi.mock("@/app/(app)/records/actions", () => ({ createTuningRecord }));
vi.mock("@/app/(app)/bench/actions", () => ({ saveTuningSet: vi.fn(), deleteTuningSet: vi.fn() }));
vi.mock("next/navigation", () => ({ useRouter: () => ({ push }) }));

// the stored plant being commissioned: the noisy cabinet's physics under a name of its own
const def = findPreset("relay-practice-noisy-cabinet")!.plant;
const baseDrill = benchDrill({ plant: { kind: "stored", definition: def, cutoutTripC: 110 }, title: "Cabinet K-7", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
const freshSwr = ({ children }: { children: ReactNode }) => <SWRConfig value={{ provider: () => new Map(), dedupingInterval: 0 }}>{children}</SWRConfig>;
const units = { temperature: "C", integral: "s", derivative: "s", gain: "kc" } as const;

/** A stand-in for the engine worker: the client's own message handling, fed by hand. */
class FakeWorker {
  static last: FakeWorker | null = null;
  onmessage: ((e: MessageEvent<FromWorker>) => void) | null = null;
  onerror: unknown = null;
  constructor() {
    FakeWorker.last = this;
  }
  postMessage() {}
  terminate() {}
}

/** The relay test the worker would run on this plant (sim/worker/bench-tests.ts, as the relay-panel test does). */
function relayOutcome() {
  const session = new BenchSession(baseDrill, { ...BENCH_START_TUNING, pvFilterTauS: 2 }, SEED);
  session.stepSamples(1);
  const t = new BenchTests(session);
  t.startRelay({ amplitudePercent: 10, cycles: 3 });
  while (t.active) t.advance(500);
  return { progress: t.progress, outcome: t.outcome! };
}

const tuningSet = (controller: unknown): TuningSetItem => ({ id: SET_ID, plantRef, name: "PID settled", notes: "", controller: controllerConfigSchema.parse(controller), createdAt: "2026-12-02T01:00:00.000Z" });

function stubTuningSets(sets: TuningSetItem[]) {
  vi.stubGlobal(
    "fetch",
    vi.fn(async (url: string) => new Response(JSON.stringify(url.startsWith("/api/tuning-sets") ? { tuningSets: sets } : { error: "No such thing." }), { status: url.startsWith("/api/tuning-sets") ? 200 : 404 })),
  );
}

const stateOf = (id: string) => screen.getByTestId(`stage-${id}`).getAttribute("data-state");
const summaryOf = (id: string) => screen.getByTestId(`stage-${id}-summary`).textContent ?? "";

beforeEach(() => {
  useBench.getState().set({ findings: NO_FINDINGS, siteProof: null, savedTuningSet: null, powerCurve: null, test: null, focus: null, units });
  createTuningRecord.mockClear();
  push.mockClear();
  vi.stubGlobal("Worker", FakeWorker);
});
afterEach(() => vi.unstubAllGlobals());

describe("the hand-over path", () => {
  it("follows the Bench stage by stage and writes a record request with the proof tests as run", async () => {
    // the plant's own tuning set list is empty until the technician saves one
    let sets: TuningSetItem[] = [];
    stubTuningSets(sets);
    const engine = new BenchEngine();
    const fromWorker = (msg: FromWorker) => act(() => FakeWorker.last!.onmessage!({ data: msg } as MessageEvent<FromWorker>));
    render(
      <>
        <HandoverPath plantRef={plantRef} plantName="Cabinet K-7" origin="physical" />
        <RelayPanel units={units} spanC={200} controllerForm="standard" onStart={vi.fn()} onCancel={vi.fn()} onApply={(cfg, origin) => origin && useBench.getState().noteApplied("relay", origin, cfg)} />
        <ProofTestBuilder baseDrill={baseDrill} />
      </>,
      { wrapper: freshSwr },
    );
    expect(["power-curve", "relay", "proof", "record"].map(stateOf)).toEqual(["open", "open", "open", "open"]);
    expect(screen.getByRole("note", { name: "Before the real heater" }).textContent).toMatch(/proven on a model.*local electrical codes and licensed practice.*excess-temperature cutout independently.*present at the first run/s);

    // (1) the worker answers the power-curve request
    const curve = powerCurve(def);
    const holding = outputForSetpoint(curve, 60);
    fromWorker({ type: "power-curve", setpointC: 60, curve, holding, staticGainCPerPercent: holding.ok ? staticGainAt(curve, holding.outPercent) : null, heatUp: heatUpTime(def, 60, curve) });
    expect(stateOf("power-curve")).toBe("done");
    expect(holding.ok).toBe(true);
    expect(summaryOf("power-curve")).toBe(`OUT ${holding.ok ? holding.outPercent.toFixed(1) : ""} % holds SP 60.0 °C.`);

    // (2) a relay result arrives; the stage waits for a rule to be applied
    const relay = relayOutcome();
    expect(relay.outcome.test === "relay" && relay.outcome.outcome.ok).toBe(true);
    fromWorker({ type: "test-outcome", ...relay.outcome });
    expect(stateOf("relay")).toBe("under-way");
    expect(summaryOf("relay")).toMatch(/^Ku [\d.]+ %\/°C, Pu [\d.]+ min; choose a rule and apply its proposal\.$/);
    // a later load (a new sample time) clears the test panel but not what it found
    fromWorker({ type: "loaded", engineVersion: "test", sampleTimeS: 0.5, seed: SEED });
    act(() => useBench.getState().set({ test: { kind: "relay", status: "finished", progress: relay.progress, outcome: relay.outcome } }));
    const relayPanel = screen.getByTestId("relay-panel");
    fireEvent.change(within(relayPanel).getByLabelText("Rule", { selector: "#relay-p-rule" }), { target: { value: "tyreus-luyben" } });
    fireEvent.click(within(relayPanel).getByRole("button", { name: "Apply…" }));
    fireEvent.click(within(relayPanel).getByRole("button", { name: "Yes, load it" }));
    expect(stateOf("relay")).toBe("done");
    expect(summaryOf("relay")).toMatch(/; Tyreus–Luyben applied\.$/);

    // (3) a site proof test from the ladder editor, then PI vs PID on it (the engine runs both)
    fireEvent.click(screen.getByRole("button", { name: "Use this timeline" }));
    const proof = useBench.getState().siteProof!;
    expect(proof.drillVersion).toBeNull();
    expect(proof.label).toBe("SP 60 → 70 → 80 → 60 °C, inlet 60 % blocked for 10 min, door open 60 s");
    expect(stateOf("proof")).toBe("under-way");
    const variants = piVersusPidVariants(BENCH_START_TUNING, { kc: 12, ti: 260, td: 40 }, { kc: 9, ti: 300 });
    const rows = [...runJobs(jobsFor(proof.drill, variants, SEED))];
    act(() => useBench.getState().note({ proofRuns: proofRunsOf({ ...proof, seed: SEED }, rows, "t1") }));
    expect(stateOf("proof")).toBe("done");
    expect(summaryOf("proof")).toMatch(/^2 runs, PI and PID side by side/);

    // (4) the PID run's tuning saved as a tuning set; the record form picks it
    const pid = useBench.getState().findings.proofRuns[1];
    sets = [tuningSet(pid.controller)];
    stubTuningSets(sets);
    act(() => useBench.getState().set({ savedTuningSet: { id: SET_ID, name: "PID settled" } }));
    expect(stateOf("record")).toBe("under-way");
    const form = screen.getByRole("form", { name: "Tuning record" });
    await waitFor(() => expect((within(form).getByLabelText("Tuning set on the record") as HTMLSelectElement).value).toBe(SET_ID));
    fireEvent.change(within(form).getByLabelText("Record title"), { target: { value: "K-7 loop TIC-3, hand-over" } });
    fireEvent.change(within(form).getByLabelText("Notes for the record"), { target: { value: "Door seal replaced before the test." } });
    const write = within(form).getByRole("button", { name: "Write tuning record" });
    await act(async () => fireEvent.click(write));
    await waitFor(() => expect(createTuningRecord).toHaveBeenCalledTimes(1));

    const payload = JSON.parse(String(createTuningRecord.mock.calls[0][1].get("payload")));
    const parsed = recordRequestSchema.safeParse(payload);
    expect(parsed.success).toBe(true);
    expect(payload).toMatchObject({ plantRef, tuningSetId: SET_ID, title: "K-7 loop TIC-3, hand-over", notes: "Door seal replaced before the test.", model: null });
    expect(payload.relay).toMatchObject({ kind: "relay", rule: "tyreus-luyben" });
    const r = relay.outcome.test === "relay" && relay.outcome.outcome.ok ? relay.outcome.outcome : null;
    expect(payload.relay).toEqual({ kind: "relay", ultimateGain: r!.ku, ultimatePeriodS: r!.puS, pvAmplitudeC: r!.amplitudeC, relayAmplitudePercent: r!.dPercent, rule: "tyreus-luyben" });
    expect(payload.powerCurve.points).toEqual(curve.points.map((p) => ({ outPercent: p.outPercent, temperatureC: p.steadyStateC })));
    // the proof tests as run: the same drill, controller and seed, the PID one named after the set it became
    expect(payload.proofTests).toHaveLength(2);
    expect(payload.proofTests.map((p: { tuningLabel: string }) => p.tuningLabel)).toEqual(["PI", "PID settled"]);
    payload.proofTests.forEach((p: { drill: unknown; controller: unknown; seed: number; drillVersion: unknown; kind: string }, i: number) => {
      expect(p.kind).toBe("proof");
      expect(p.drill).toEqual(JSON.parse(JSON.stringify(proof.drill)));
      expect(p.controller).toEqual(JSON.parse(JSON.stringify(rows[i].controller)));
      expect(p.seed).toBe(SEED);
      expect(p.drillVersion).toBeNull();
    });
    // the server's re-run of that drill would start where the Bench's did
    expect(drillSchema.parse(payload.proofTests[0].drill).plant).toEqual(def);

    await waitFor(() => expect(push).toHaveBeenCalledWith(`/records/${RECORD_ID}`));
    expect(stateOf("record")).toBe("done");
    engine.dispose();
  });

  it("leaves out proof tests on request, and refuses a record without a tuning set", async () => {
    stubTuningSets([]);
    const variants = piVersusPidVariants(BENCH_START_TUNING, { kc: 12, ti: 260, td: 40 }, { kc: 9, ti: 300 });
    const drill = benchDrill({ plant: { kind: "stored", definition: def, cutoutTripC: 110 }, title: "K-7", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
    const short = { ...drill, events: [{ type: "setpoint" as const, timeS: 60, setpointC: 65 }], scoring: { windows: [{ id: "s", kind: "setpoint" as const, startS: 60, endS: 600 }] }, durationS: 600 };
    const rows = [...runJobs(jobsFor(short, variants, SEED))];
    useBench.getState().note({ proofRuns: proofRunsOf({ label: "step 60 → 65 °C", drill: short, drillVersion: null, seed: SEED }, rows, "t2") });
    render(<HandoverPath plantRef={plantRef} plantName="Cabinet K-7" origin="twin" />, { wrapper: freshSwr });
    const form = screen.getByRole("form", { name: "Tuning record" });
    expect((within(form).getByRole("button", { name: "Write tuning record" }) as HTMLButtonElement).disabled).toBe(true);
    expect(within(form).getByTestId("record-contents").textContent).toMatch(/the twin's identified model \(filled in by the server\)/);

    stubTuningSets([tuningSet(BENCH_START_TUNING)]);
    const { unmount } = render(<HandoverPath plantRef={plantRef} plantName="Cabinet K-7" origin="twin" />, { wrapper: freshSwr });
    const forms = screen.getAllByRole("form", { name: "Tuning record" });
    const second = forms[1];
    await waitFor(() => expect((within(second).getByRole("button", { name: "Write tuning record" }) as HTMLButtonElement).disabled).toBe(false));
    fireEvent.click(within(second).getByRole("checkbox", { name: /step 60 → 65 °C · PI\b(?!D)/ }));
    await act(async () => fireEvent.click(within(second).getByRole("button", { name: "Write tuning record" })));
    await waitFor(() => expect(createTuningRecord).toHaveBeenCalledTimes(1));
    const payload = JSON.parse(String(createTuningRecord.mock.calls[0][1].get("payload")));
    expect(recordRequestSchema.safeParse(payload).success).toBe(true);
    expect(payload.model).toBeNull(); // a twin's model is the server's to fill in
    expect(payload.relay).toBeNull();
    expect(payload.proofTests.map((p: { label: string }) => p.label)).toEqual(["step 60 → 65 °C · PID"]);
    unmount();
  });

  it("says that a record on a private plant is read by the whole organisation", async () => {
    stubTuningSets([]);
    const { unmount } = render(<HandoverPath plantRef={plantRef} plantName="Cabinet K-7" origin="twin" privatePlant />, { wrapper: freshSwr });
    expect(screen.getByTestId("record-visibility-note").textContent).toMatch(/private to you.*everyone in your organisation can read it.*source file/);
    unmount();
    render(<HandoverPath plantRef={plantRef} plantName="Cabinet K-7" origin="twin" />, { wrapper: freshSwr });
    expect(screen.queryByTestId("record-visibility-note")).toBeNull();
  });

  it("brings the right Bench panel forward from each stage's button", async () => {
    stubTuningSets([]);
    render(<HandoverPath plantRef={plantRef} plantName="Cabinet K-7" origin="physical" />, { wrapper: freshSwr });
    await screen.findByText("no tuning set saved for this plant");
    const asked = (name: string) => {
      fireEvent.click(screen.getByRole("button", { name }));
      return useBench.getState().focus?.panel;
    };
    expect(asked("Show the power curve")).toBe("power-curve");
    expect(asked("Go to the relay test")).toBe("relay");
    expect(asked("Go to the proof tests")).toBe("proof");
    expect(asked("Go to the tuning sets")).toBe("tuning-sets");
  });
});

describe("the site proof test from a stored drill", () => {
  it("takes a published version, runs it on this plant and says so", async () => {
    const drillId = "6b1d2c40-7a1e-4c55-9e0a-3f8d2b6c1a02";
    const doc = starterDocument("airflow-disturbance", drillId, "Lint on the inlet");
    const listItem = { id: drillId, title: "Lint on the inlet", ownerName: "Ada", mine: false, sharedWithOrg: true, archivedAt: null, createdAt: "", updatedAt: "", status: "published", latestVersion: 3, draftVersion: null, publishedVersions: [1, 3], lastPublishedAt: "" };
    const fetchMock = vi.fn(async (url: string) => {
      const body = url === "/api/drills" ? { drills: [listItem] } : url === `/api/drills/${drillId}/versions/3` ? { version: { drillId, version: 3, status: "published", publishedAt: "", document: drillSchema.parse(doc) } } : null;
      return new Response(JSON.stringify(body ?? { error: "No such thing." }), { status: body ? 200 : 404 });
    });
    vi.stubGlobal("fetch", fetchMock);
    render(<ProofTestBuilder baseDrill={baseDrill} />, { wrapper: freshSwr });
    fireEvent.click(screen.getByRole("radio", { name: "a stored drill" }));
    const version = (await screen.findByLabelText("Published version")) as HTMLSelectElement;
    expect(version.value).toBe("3"); // the latest published version first
    await act(async () => fireEvent.click(screen.getByRole("button", { name: "Use this drill" })));
    const proof = useBench.getState().siteProof!;
    expect(proof.drillVersion).toEqual({ drillId, version: 3, title: "Lint on the inlet" });
    expect(proof.label).toBe("Lint on the inlet v3");
    expect(proof.drill.plant).toEqual(def);
    expect(proof.drill.cutout).toEqual({ tripPointC: 110 });
    expect(proof.drill.events).toEqual(drillSchema.parse(doc).events);
    expect(screen.getByTestId("site-proof-current").textContent).toMatch(/its plant, sensor chain, final element and cutout are this plant's/);
  });

  it("tells an account without drills to build a timeline instead", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => new Response(JSON.stringify({ error: "You are not allowed to do that." }), { status: 403 })));
    render(<ProofTestBuilder baseDrill={baseDrill} />, { wrapper: freshSwr });
    fireEvent.click(screen.getByRole("radio", { name: "a stored drill" }));
    expect((await screen.findByText(/Stored drills are not available to this account/)).textContent).toMatch(/build a timeline here instead/);
  });
});

describe("the experiments panel with a site proof test", () => {
  it("compares PI with PID on the site proof test and keeps it with the runs", () => {
    const start = vi.fn();
    const idle: ExperimentState = { kind: null, status: "idle", done: 0, total: 0, rows: [], elapsedMs: null, error: null };
    render(<ExperimentsPanel baseDrill={baseDrill} controller={controllerConfigSchema.parse(BENCH_START_TUNING)} seed={SEED} state={idle} start={start} cancel={vi.fn()} siteProofEditor={<ProofTestBuilder baseDrill={baseDrill} />} />, { wrapper: freshSwr });
    fireEvent.click(screen.getByRole("tab", { name: "PI vs PID" }));
    fireEvent.click(screen.getByRole("button", { name: "Run experiment" }));
    expect(start).not.toHaveBeenCalled();
    expect(screen.getByRole("alert").textContent).toMatch(/Build the site proof test first/);

    fireEvent.click(screen.getByRole("button", { name: "Use this timeline" }));
    fireEvent.click(screen.getByRole("button", { name: "Run experiment" }));
    expect(start).toHaveBeenCalledTimes(1);
    const [kind, jobs, meta] = start.mock.calls[0];
    const proof = useBench.getState().siteProof!;
    expect(kind).toBe("compare");
    expect(jobs.map((j: { label: string }) => j.label.split(" ")[0])).toEqual(["PI", "PID"]);
    expect(jobs[0].drill).toEqual(drillSchema.parse(proof.drill));
    expect(meta).toEqual({ proof: { ...proof, seed: SEED } });

    // a relay rule applied: PI and PID are filled in from the same rule on the same Ku and Pu
    act(() => useBench.getState().noteApplied("relay", { rule: "ziegler-nichols-ultimate", controllerType: "PID", model: null }, controllerConfigSchema.parse(BENCH_START_TUNING)));
    act(() => useBench.getState().note({ relay: { ku: 20, puS: 400, amplitudeC: 0.5, dPercent: 10 } }));
    // Ziegler and Nichols, Trans. ASME 64 (1942), ultimate-cycle table: PI Kc = 0.45 Ku, Ti = Pu/1.2; PID Kc = 0.6 Ku, Ti = Pu/2, Td = Pu/8
    expect((screen.getByLabelText("PI Kc") as HTMLInputElement).value).toBe("9");
    expect(Number((screen.getByLabelText("PI Ti") as HTMLInputElement).value)).toBeCloseTo(333, 0);
    expect((screen.getByLabelText("PID Kc") as HTMLInputElement).value).toBe("12");
    expect((screen.getByLabelText("PID Ti") as HTMLInputElement).value).toBe("200");
    expect((screen.getByLabelText("PID Td") as HTMLInputElement).value).toBe("50");
    expect(screen.getByTestId("compare-suggestion").textContent).toMatch(/Ziegler–Nichols, ultimate on the relay result/);

    // the plain SP step is still there
    fireEvent.click(screen.getByRole("radio", { name: "one SP step" }));
    fireEvent.click(screen.getByRole("button", { name: "Run experiment" }));
    expect(start.mock.calls[1][2]).toBeUndefined();
  });
});
