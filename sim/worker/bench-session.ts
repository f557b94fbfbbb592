/**
 * One Bench run inside the worker: a Simulation plus what has already been streamed. Pure (no
 * worker globals), so the pacing and chunking are tested in Node.
 */
import { controllerConfigSchema, type ControllerConfigInput } from "../control/config";
import { actionLogSchema, operatorActionSchema, type OperatorActionInput, type StampedAction } from "../drill/actions";
import { drillSchema, type DrillInput } from "../drill/schema";
import { Simulation } from "../drill/simulation";
import type { FromWorker } from "./protocol";

export class BenchSession {
  readonly simulation: Simulation;
  private streamed = 0;
  private eventsStreamed = 0;
  private actionsStreamed = 0;

  /** `actions`: a recorded log to replay (a saved run reopened); they apply at their stamps. */
  constructor(drill: DrillInput, controller?: ControllerConfigInput, seed?: number, actions: readonly StampedAction[] = []) {
    this.simulation = new Simulation(drillSchema.parse(drill), {
      controller: controller ? controllerConfigSchema.parse(controller) : undefined,
      seed,
    });
    if (actions.length) this.simulation.schedule(actionLogSchema.parse(actions));
  }

  get sampleTimeS(): number {
    return this.simulation.sampleTimeS;
  }

  /** The run has reached the end of its drill (the Bench's run length); it stops there. */
  get finished(): boolean {
    return this.simulation.finished;
  }

  /** Simulate up to `samples` whole samples, never past the end of the drill. */
  stepSamples(samples: number): void {
    const sim = this.simulation;
    for (let i = 0; i < samples && !sim.finished; i++) sim.step();
  }

  /** Simulate for up to `budgetMs` of wall time, in batches; returns the samples done. */
  runFor(budgetMs: number, now: () => number, batch = 200): number {
    const start = now();
    let done = 0;
    while (now() - start < budgetMs && !this.finished) {
      this.stepSamples(batch);
      done += batch;
    }
    return done;
  }

  act(action: OperatorActionInput): void {
    this.simulation.act(operatorActionSchema.parse(action));
  }

  /** Rows and events not yet streamed, as a chunk message; null when nothing is new. */
  takeChunk(): Extract<FromWorker, { type: "chunk" }> | null {
    const sim = this.simulation;
    const length = sim.trace().length;
    if (length === this.streamed) return null;
    const from = this.streamed;
    const trace = sim.traceChunk(from, length);
    this.streamed = length;
    const events = sim.events.slice(this.eventsStreamed);
    this.eventsStreamed = sim.events.length;
    const actions = sim.actionLog.slice(this.actionsStreamed);
    this.actionsStreamed = sim.actionLog.length;
    return { type: "chunk", from, trace, snapshot: sim.snapshot(), events, actions };
  }
}
