// Type declarations for odex 2.0.4 (Hairer's ODEX extrapolation solver, CommonJS, untyped).
// The package ships a .ts source that fails strict checking, so tsconfig maps "odex" here.
export interface Derivative {
  (x: number, y: number[]): number[];
}
export interface OutputFunction {
  (nr: number, xold: number, x: number, y: number[], dense?: (c: number, x: number) => number): boolean | void;
}
export enum Outcome {
  Converged = 0,
  MaxStepsExceeded = 1,
  EarlyReturn = 2,
}
export interface SolverResult {
  y: number[];
  outcome: Outcome;
  nStep: number;
  xEnd: number;
  nAccept: number;
  nReject: number;
  nEval: number;
}
export class Solver {
  constructor(n: number);
  n: number;
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  relativeTolerance: number | number[];
  absoluteTolerance: number | number[];
  debug: boolean;
  grid(dt: number, out: (xOut: number, yOut: number[]) => unknown): OutputFunction;
  solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): SolverResult;
}
