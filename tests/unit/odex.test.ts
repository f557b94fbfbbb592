import { describe, expect, it } from "vitest";
import { Solver } from "odex";

// The nonlinear plant mode and the accuracy reference rely on odex (Hairer's ODEX).
// Check: dy/dt = −y, y(0) = 1 has y(1) = e^−1 exactly (analytic solution).
describe("odex integrates a linear ODE", () => {
  it("matches exp(-1) at tight tolerance", () => {
    const solver = new Solver(1);
    solver.relativeTolerance = 1e-12;
    solver.absoluteTolerance = 1e-12;
    const result = solver.solve((_t, y) => [-y[0]], 0, [1], 1);
    expect(Math.abs(result.y[0] - Math.exp(-1))).toBeLessThan(1e-12);
  });
});
