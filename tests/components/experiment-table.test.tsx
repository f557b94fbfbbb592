// The experiment table shows each run's results side by side, straight from the engine's results
// (here a real sweep of three PV filter values on the benchtop preset, run in-process with the
// same runJobs the experiments worker uses).
import { fireEvent, render, screen, within } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { ExperimentTable } from "@/components/bench/experiments/ExperimentTable";
import { benchDrill, BENCH_START_TUNING } from "@/components/bench/bench-drill";
import { experimentDrill } from "@/sim/experiments/experiment-drill";
import { sweepVariants } from "@/sim/experiments/sweep";
import { jobsFor, runJobs } from "@/sim/experiments/variants";

const drill = experimentDrill(benchDrill({ plant: { kind: "preset", presetId: "benchtop-curing-cabinet" }, title: "t", setpointC: 60, reference: BENCH_START_TUNING, seed: 7 }), { stepC: 5, durationS: 900 });
const rows = [...runJobs(jobsFor(drill, sweepVariants(BENCH_START_TUNING, "pvFilterTauS", [0, 2, 8]), 7))];

describe("ExperimentTable", () => {
  it("has one row per run with its measured IAE, and loads a run's tuning", () => {
    const onLoad = vi.fn();
    render(<ExperimentTable rows={rows} onLoad={onLoad} />);
    const lines = screen.getAllByTestId("experiment-row");
    expect(lines).toHaveLength(3);
    expect(within(lines[1]).getByText("PV filter τf = 2 s")).toBeTruthy();
    const iae = screen.getAllByTestId("experiment-iae").map((c) => Number(c.textContent));
    expect(iae).toEqual(rows.map((r) => Number(r.results.windows[0].trueTemperature.iae.toFixed(1))));
    expect(iae[2]).not.toBe(iae[0]); // the filter changes the result
    fireEvent.click(within(lines[2]).getByRole("button", { name: "load tuning" }));
    expect(onLoad.mock.calls[0][0].controller.pvFilterTauS).toBe(8);
  });

  it("renders nothing before the first run", () => {
    const { container } = render(<ExperimentTable rows={[]} />);
    expect(container.innerHTML).toBe("");
  });
});
