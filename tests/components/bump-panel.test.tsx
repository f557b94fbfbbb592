// The bump-test panel with a real outcome (the worker's test runner on the Bench's free-run drill
// of the benchtop cabinet): both fitted models with their fit quality, the preferred one marked,
// the proposal, and Apply only after confirmation. uPlot is replaced by a stub (jsdom has no canvas).
import { act, fireEvent, render, screen, within } from "@testing-library/react";
import { beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("uplot", () => ({ default: class { destroy() {} } }));

import { BENCH_START_TUNING, benchDrill } from "@/components/bench/bench-drill";
import { useBench } from "@/components/bench/store";
import { BumpPanel } from "@/components/bench/tests/BumpPanel";
import { BenchSession } from "@/sim/worker/bench-session";
import { BenchTests } from "@/sim/worker/bench-tests";

const SEED = 20261201;
let finished: { progress: ReturnType<BenchTests["takeProgress"]>; outcome: BenchTests["outcome"] };

beforeAll(() => {
  const drill = benchDrill({ plant: { kind: "preset", presetId: "benchtop-curing-cabinet" }, title: "cabinet", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
  const session = new BenchSession(drill, BENCH_START_TUNING, SEED);
  session.stepSamples(1);
  const t = new BenchTests(session);
  t.startBump({ stepPercent: 10 });
  while (t.active) t.advance(2000);
  finished = { progress: t.progress, outcome: t.outcome };
});

const setup = () => {
  const onStart = vi.fn();
  const onApply = vi.fn();
  render(<BumpPanel units={{ temperature: "C", integral: "s", derivative: "s", gain: "kc" }} spanC={200} controllerForm="standard" onStart={onStart} onCancel={vi.fn()} onApply={onApply} />);
  return { onStart, onApply };
};

describe("BumpPanel", () => {
  it("starts a bump test with the step size; refuses a step outside 1–50 %", () => {
    act(() => useBench.getState().set({ test: null }));
    const { onStart } = setup();
    fireEvent.change(screen.getByLabelText("OUT step"), { target: { value: "0.2" } });
    fireEvent.click(screen.getByRole("button", { name: "Start bump test" }));
    expect(onStart).not.toHaveBeenCalled();
    expect(screen.getByRole("alert").textContent).toMatch(/between 1 and 50/);
    fireEvent.change(screen.getByLabelText("OUT step"), { target: { value: "8" } });
    fireEvent.click(screen.getByRole("button", { name: "Start bump test" }));
    expect(onStart.mock.calls[0][0]).toMatchObject({ stepPercent: 8 });
  });

  it("shows both fits with R² and NRMSE, the preferred model, and applies the proposal after confirmation", () => {
    act(() => useBench.getState().set({ test: { kind: "bump", status: "finished", progress: finished.progress, outcome: finished.outcome } }));
    const { onApply } = setup();
    const o = finished.outcome;
    if (o?.test !== "bump" || !o.outcome.ok) throw new Error("the bump test should identify a model");
    const fit = screen.getByTestId("bump-fit");
    expect(fit.textContent).toMatch(/FOPDT/);
    expect(fit.textContent).toMatch(/SOPDT/);
    expect(fit.textContent).toMatch(/preferred/);
    expect(Number(screen.getByTestId("bump-r2").textContent)).toBeCloseTo(o.outcome.identification.fopdt.quality.r2, 4);
    expect(fit.textContent).toMatch(/NRMSE/);
    expect(screen.getByTestId("bump-tuning").textContent).toMatch(/Gain Kc/);
    fireEvent.click(screen.getByRole("button", { name: "Apply…" }));
    expect(onApply).not.toHaveBeenCalled();
    fireEvent.click(within(screen.getByRole("group", { name: "Confirm the new tuning" })).getByRole("button", { name: "Yes, load it" }));
    expect(onApply).toHaveBeenCalledTimes(1);
    expect(onApply.mock.calls[0][0].kind).toBe("pid");
  });

  it("shows the refusal when the record gives no model", () => {
    act(() =>
      useBench.getState().set({
        test: { kind: "bump", status: "finished", progress: null, outcome: { test: "bump", base: finished.outcome!.base, outcome: { ok: false, record: { t: [], out: [], pv: [] }, refusal: { ok: false, code: "no-response", message: "PV shows no response to the step" } } } },
      }),
    );
    setup();
    expect(screen.getByTestId("bump-refusal").textContent).toMatch(/No model from this record: PV shows no response to the step/);
  });
});
