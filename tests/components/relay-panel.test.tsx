// The relay-test panel: the noise check stops the test before the relay switches and offers
// "Start anyway"; the noise abort shows its reason; a result is shown with its proposal, and
// applying it needs an explicit confirmation. The outcomes are real ones, computed here by the
// worker's test runner on the noisy-sensor cabinet (sim/worker/bench-tests.ts).
import { act, fireEvent, render, screen, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { BENCH_START_TUNING, benchDrill } from "@/components/bench/bench-drill";
import { useBench } from "@/components/bench/store";
import { RelayPanel } from "@/components/bench/tests/RelayPanel";
import type { RelayTestOptions } from "@/sim/tuning/relay/relay-test";
import { BenchSession } from "@/sim/worker/bench-session";
import { BenchTests } from "@/sim/worker/bench-tests";

const SEED = 20261201;

/** What the worker would post at the end of a relay test with these options. */
function workerOutcome(pvFilterTauS: number, options: RelayTestOptions) {
  const drill = benchDrill({ plant: { kind: "preset", presetId: "relay-practice-noisy-cabinet" }, title: "noisy", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
  const session = new BenchSession(drill, { ...BENCH_START_TUNING, pvFilterTauS }, SEED);
  session.stepSamples(1);
  const t = new BenchTests(session);
  t.startRelay(options);
  while (t.active) t.advance(500);
  return { progress: t.progress, outcome: t.outcome };
}

function finish(r: ReturnType<typeof workerOutcome>) {
  act(() => useBench.getState().set({ test: { kind: "relay", status: "finished", progress: r.progress, outcome: r.outcome } }));
}

const setup = () => {
  const onStart = vi.fn();
  const onApply = vi.fn();
  render(<RelayPanel units={{ temperature: "C", integral: "s", derivative: "s", gain: "kc" }} spanC={200} controllerForm="standard" onStart={onStart} onCancel={vi.fn()} onApply={onApply} />);
  return { onStart, onApply };
};

beforeEach(() => {
  useBench.getState().set({ test: null });
});

describe("RelayPanel", () => {
  it("starts with the noise check armed; the warning shows ε against 3σ and 'Start anyway' restarts past it", () => {
    const { onStart } = setup();
    fireEvent.change(screen.getByLabelText("Hysteresis ε"), { target: { value: "0.5" } });
    fireEvent.click(screen.getByRole("button", { name: "Start relay test" }));
    expect(onStart).toHaveBeenCalledTimes(1);
    const [opts, pace] = onStart.mock.calls[0];
    expect(opts).toMatchObject({ hysteresisC: 0.5, stopOnNoiseWarning: true, amplitudePercent: 10, cycles: 3 });
    expect(pace).toBe("bench");

    finish(workerOutcome(0, opts));
    const warning = screen.getByTestId("relay-noise-warning");
    expect(warning.textContent).toMatch(/Hysteresis ε\s*0\.5\s°C/);
    expect(warning.textContent).toMatch(/3σ of the PV the controller sees\s*0\.9\d\d\s°C/); // σ ≈ 0.32 °C on this sensor
    expect(warning.textContent).toMatch(/Add a PV filter/);
    fireEvent.click(within(warning).getByRole("button", { name: "Start anyway" }));
    expect(onStart).toHaveBeenCalledTimes(2);
    expect(onStart.mock.calls[1][0]).toMatchObject({ hysteresisC: 0.5, stopOnNoiseWarning: false });
  });

  it("shows the abort reason when noise fools the relay", () => {
    setup();
    finish(workerOutcome(0, { hysteresisC: 0.5, stopOnNoiseWarning: false }));
    const abort = screen.getByTestId("relay-abort");
    expect(abort.textContent).toMatch(/Noise fooled the relay/);
    expect(abort.textContent).toMatch(/noise is switching the relay.*Add a PV filter.*widen the hysteresis/);
    expect(screen.queryByTestId("relay-result")).toBeNull();
  });

  it("shows live progress while the test runs", () => {
    setup();
    act(() =>
      useBench.getState().set({
        test: { kind: "relay", status: "running", outcome: null, progress: { test: "relay", progress: { phase: "relay", timeS: 120, crossings: 5, halfPeriodsS: [20, 22, 21, 23], amplitudeC: 1.2, kuEstimate: 12.5, puEstimateS: 44, cyclesMeasured: 1 } } },
      }),
    );
    const p = screen.getByTestId("relay-progress");
    expect(screen.getByTestId("relay-phase").textContent).toBe("relay oscillating");
    expect(screen.getByTestId("relay-crossings").textContent).toBe("5");
    expect(p.textContent).toMatch(/20\.0, 22\.0, 21\.0, 23\.0 s/);
    expect(p.textContent).toMatch(/Amplitude a\s*1\.2\s°C/);
    expect(p.textContent).toMatch(/Ku \(running\)\s*12\.5\s%\/°C/);
    expect(p.textContent).toMatch(/Pu \(running\)\s*44\ss/);
    expect(screen.getByRole("button", { name: "Cancel the relay test" })).toBeTruthy();
  });

  it("shows the result and applies the proposal only after confirmation", () => {
    const { onApply } = setup();
    const r = workerOutcome(1, { hysteresisC: 0.5, stopOnNoiseWarning: true });
    if (r.outcome?.test !== "relay" || !r.outcome.outcome.ok) throw new Error("the filtered relay test should complete");
    const result = r.outcome.outcome;
    finish(r);
    expect(screen.getByTestId("relay-result")).toBeTruthy();
    expect(screen.getByTestId("relay-ku").textContent).toContain("%/°C");
    expect(screen.getByTestId("relay-result").textContent).toMatch(/4d\/\(π√\(a² − ε²\)\)/);
    expect(screen.getByTestId("relay-fopdt").textContent).toMatch(/K from the power curve/);
    expect(screen.getByTestId("relay-sp-tracking").textContent).toMatch(/SP did not track PV/);
    expect(screen.getByTestId("relay-robustness").textContent).toMatch(/Ms/);
    expect(screen.getByTestId("relay-sample-filter").textContent).toMatch(/Recommended PV filter τf/);

    fireEvent.click(screen.getByRole("button", { name: "Apply…" }));
    expect(onApply).not.toHaveBeenCalled();
    const confirm = screen.getByRole("group", { name: "Confirm the new tuning" });
    fireEvent.click(within(confirm).getByRole("button", { name: "Yes, load it" }));
    expect(onApply).toHaveBeenCalledTimes(1);
    const rec = result.proposal.recommended;
    if ("refused" in rec) throw new Error(rec.reason);
    expect(onApply.mock.calls[0][0].kc).toBeCloseTo(rec.controllerConfig!.kc, 9);
    expect(screen.getByRole("status").textContent).toMatch(/Loaded into the controller/);
  });

  it("says so when the chosen tuning is not representable in series form, and offers no Apply", () => {
    setup();
    const r = workerOutcome(1, { hysteresisC: 0.5 });
    finish(r);
    // Ziegler–Nichols "no overshoot" PID (Ti = Pu/2, Td = Pu/3, from memory of the published table):
    // Ti < 4·Td, complex zeros, which a series (interacting) PID cannot produce
    fireEvent.change(screen.getByLabelText("Rule", { selector: "#relay-p-rule" }), { target: { value: "ziegler-nichols-no-overshoot" } });
    fireEvent.change(screen.getByLabelText("Form", { selector: "#relay-p-form" }), { target: { value: "series" } });
    expect(screen.getByTestId("relay-not-representable").textContent).toMatch(/Not representable in the series \(interacting\) form/);
    expect(screen.queryByRole("button", { name: "Apply…" })).toBeNull();
  });
});
