// The attempt review and its parts: the replay in the browser (the engine worker replaced by a
// stand-in running the worker's own BenchSession in-process) matches the server's fingerprint
// (runDrill, the server's replay, on the same inputs); a second attempt is overlaid with its
// legend; the compare selector navigates to ?compare=; the action log is in words for every action
// type; the feedback per window (sim/drill/feedback.ts, computed for real here) shows its finding,
// hint and verdict; the status badge.
import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";

vi.mock("uplot", () => ({ default: class { destroy() {} } }));
const push = vi.hoisted(() => vi.fn());
vi.mock("next/navigation", () => ({ useRouter: () => ({ push, replace: vi.fn(), refresh: vi.fn() }), usePathname: () => "/attempts/a-1", useSearchParams: () => new URLSearchParams("") }));

import ladder from "@/sim/examples/setpoint-ladder.json";
import type { AttemptDetail } from "@/app/_lib/classroom/contracts";
import { AttemptReview } from "@/components/attempts/AttemptReview";
import { AttemptStatusBadge } from "@/components/attempts/AttemptStatusBadge";
import { ActionLogList, describeAction } from "@/components/attempts/ActionLogList";
import { WindowFeedbackList } from "@/components/attempts/WindowFeedbackList";
import type { WorkerFactory } from "@/components/attempts/use-attempt-replay";
import { controllerConfigSchema } from "@/sim/control/config";
import { feedbackFromRuns } from "@/sim/drill/feedback";
import { runDrill } from "@/sim/drill/run-drill";
import { drillSchema, type DrillInput } from "@/sim/drill/schema";
import { attemptSummary } from "@/sim/drill/summary";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import { BenchSession } from "@/sim/worker/bench-session";
import type { FromWorker, ToWorker } from "@/sim/worker/protocol";

const SEED = 2718;
const drill = drillSchema.parse({
  ...(ladder as unknown as DrillInput),
  id: "ladder-first-step",
  events: [{ type: "setpoint", timeS: 300, setpointC: 80 }],
  scoring: { ...(ladder as unknown as DrillInput).scoring, windows: [{ id: "step-80", label: "60 → 80 °C", kind: "setpoint", startS: 300, endS: 600, weight: 2 }] },
  durationS: 600,
});
const controller = controllerConfigSchema.parse({ ...drill.referenceTuning, kc: (drill.referenceTuning.kc ?? 2) * 2.5 });
const h = controller.sampleTimeS;
const actionLog = [
  { sample: Math.round(120 / h), type: "tuning" as const, controller: { ...controller, kc: controller.kc * 0.8 } },
  { sample: Math.round(200 / h), type: "setpoint" as const, setpointC: 62 },
];

function detail(over: Partial<AttemptDetail> = {}, ctrl = controller, log: unknown[] = actionLog): AttemptDetail {
  const f = feedbackFromRuns(drill, ctrl, log as never, SEED);
  const run = runDrill(drill, ctrl, log as never, SEED);
  return {
    id: "a-1",
    number: 2,
    status: "verified",
    startedAt: "2026-11-20T09:00:00Z",
    submittedAt: "2026-11-20T09:30:00Z",
    verifiedAt: "2026-11-20T09:31:00Z",
    late: true,
    assignment: { id: "as-1", title: "Week 3: cure ladder", cohortId: "c-1", dueAt: "2026-11-20T09:00:00Z", timeZone: "Europe/Berlin", attemptLimit: 3 },
    trainee: { id: "t-1", name: "Ada Brook" },
    drill: drill as unknown as Record<string, unknown>,
    drillVersion: 4,
    seed: SEED,
    controller: ctrl as unknown as Record<string, unknown>,
    actionLog: log,
    official: { engineVersion: run.trace.engineVersion, fingerprint: traceFingerprint(run.trace), summary: attemptSummary(f.results, f.score), windows: f.feedback, violations: [] },
    flagged: true,
    flagReason: "claimed score 71.0 against the replay's 52.3",
    canReview: true,
    feedback: [{ id: "f-1", authorName: "Ian Instructor", body: "Less gain next time.", createdAt: "2026-11-20T10:00:00Z" }],
    ...over,
  };
}

/** The engine worker, in-process: the worker's own session, streamed as one chunk at "run". */
class FakeWorker {
  onmessage: ((e: MessageEvent<FromWorker>) => void) | null = null;
  onerror: ((e: ErrorEvent) => void) | null = null;
  terminated = false;
  private session: BenchSession | null = null;
  private emit(m: FromWorker) {
    setTimeout(() => {
      if (!this.terminated) this.onmessage?.({ data: m } as MessageEvent<FromWorker>);
    }, 0);
  }
  postMessage(m: ToWorker) {
    if (m.type === "load") {
      this.session = new BenchSession(m.drill, m.controller, m.seed, m.actions);
      this.emit({ type: "status", running: false, speed: 60 });
      this.emit({ type: "loaded", engineVersion: this.session.simulation.engineVersion, sampleTimeS: this.session.sampleTimeS, seed: SEED });
      this.session.stepSamples(1);
      this.emit(this.session.takeChunk()!);
    } else if (m.type === "run" && this.session) {
      this.emit({ type: "status", running: true, speed: m.speed });
      this.session.stepSamples(1e7);
      this.emit(this.session.takeChunk()!);
      this.emit({ type: "status", running: false, speed: m.speed });
    }
  }
  terminate() {
    this.terminated = true;
  }
}
const fakeWorker: WorkerFactory = () => new FakeWorker() as unknown as Worker;

describe("AttemptReview", () => {
  it("replays the attempt in the browser and says it matches the server's trace; header, flag, log, feedback", async () => {
    const a = detail();
    render(<AttemptReview attempt={a} feedbackForm={<form aria-label="the page's feedback form" />} makeWorker={fakeWorker} />);
    expect(screen.getByRole("heading", { level: 1 }).textContent).toContain("Ada Brook — attempt 2");
    expect(screen.getByTestId("attempt-status").textContent).toBe("verified");
    expect(screen.getByText("late")).toBeTruthy();
    expect(screen.getByTestId("attempt-flag-reason").textContent).toContain("claimed score 71.0");
    expect(screen.getByText(a.official!.engineVersion)).toBeTruthy();
    expect(screen.getByText("Less gain next time.")).toBeTruthy();
    expect(screen.getByRole("form", { name: "the page's feedback form" })).toBeTruthy();
    await waitFor(() => expect(screen.getByTestId("replay-match").textContent).toContain("replay matches the server's trace ✓"), { timeout: 10_000 });
    expect(screen.getByTestId("attempt-trend")).toBeTruthy();
    const items = within(screen.getByTestId("action-log")).getAllByTestId("action-log-item");
    expect(items).toHaveLength(2);
    expect(items[0].textContent).toContain(`#${Math.round(120 / h)}`);
    expect(items[0].textContent).toContain("2:00");
    expect(items[0].textContent).toContain(`Kc ${controller.kc} → ${Number((controller.kc * 0.8).toPrecision(6))} %/°C`);
    expect(items[1].textContent).toContain("SP 62.0 °C");
    expect(screen.getAllByTestId("window-feedback-item")).toHaveLength(1);
  });

  it("says nothing about a match when the trainee sees an attempt without the flag, and says when the replay differs", async () => {
    const a = detail({ canReview: false, official: { ...detail().official!, fingerprint: "0123456789abcdef" } });
    render(<AttemptReview attempt={a} makeWorker={fakeWorker} />);
    expect(screen.queryByTestId("attempt-flagged")).toBeNull();
    expect(screen.queryByTestId("attempt-flag-reason")).toBeNull();
    await waitFor(() => expect(screen.getByTestId("replay-mismatch")).toBeTruthy(), { timeout: 10_000 });
    expect(screen.queryByTestId("replay-match")).toBeNull();
  });

  it("overlays a second attempt with its legend and navigates to ?compare= from the selector", async () => {
    const other = detail({ id: "a-2", number: 1, trainee: { id: "t-2", name: "Ben Carter" } }, controllerConfigSchema.parse(drill.referenceTuning), []);
    render(<AttemptReview attempt={detail()} compareWith={other} compareOptions={[{ id: "a-2", label: "Ben Carter · attempt 1" }, { id: "a-3", label: "Cleo Dunn · attempt 1" }]} makeWorker={fakeWorker} />);
    expect(screen.getByTestId("compare-legend").textContent).toContain("attempt 1 — Ben Carter");
    expect(screen.getByTestId("compare-legend").textContent).toContain("attempt 2 — Ada Brook");
    const select = screen.getByRole("combobox", { name: "Compare with another attempt" }) as HTMLSelectElement;
    expect(select.value).toBe("a-2");
    fireEvent.change(select, { target: { value: "a-3" } });
    expect(push).toHaveBeenCalledWith("/attempts/a-1?compare=a-3");
    await waitFor(() => expect(screen.getByTestId("replay-match")).toBeTruthy(), { timeout: 10_000 });
  });

  it("a verifying attempt shows the pulsing badge and no official results yet", async () => {
    render(<AttemptReview attempt={detail({ status: "verifying", official: null, verifiedAt: null })} makeWorker={fakeWorker} />);
    const badge = screen.getByTestId("attempt-status");
    expect(badge.textContent).toBe("verifying…");
    expect(badge.className).toContain("animate-pulse");
    expect(screen.getByText("No official results yet.")).toBeTruthy();
    await act(async () => {
      await new Promise((r) => setTimeout(r, 50));
    });
    expect(screen.queryByTestId("replay-match")).toBeNull(); // nothing to match against
  });
});

describe("WindowFeedbackList", () => {
  it("shows each window's measures with units, ratio, score, verdict, finding and hint (standalone)", () => {
    const f = feedbackFromRuns(drill, controller, [], SEED);
    const w = f.feedback[0];
    render(<WindowFeedbackList windows={f.feedback} summary={attemptSummary(f.results, f.score)} />);
    const item = screen.getByTestId("window-feedback-item");
    expect(within(item).getByText("60 → 80 °C")).toBeTruthy();
    expect(within(item).getByTestId("window-finding").textContent).toBe(w.finding);
    expect(within(item).getByTestId("window-hint").textContent).toContain(w.hint);
    expect(within(item).getByTestId("window-verdict").textContent).toBe(`${w.verdict === "close" ? "close to" : `${w.verdict} than`} the reference`);
    expect(item.textContent).toContain(`${w.measured.iae.toFixed(0)} °C·s vs ${w.reference.iae.toFixed(0)} °C·s (×${w.ratios.iae.toFixed(2)})`);
    expect(item.textContent).toContain(`score ${w.score.toFixed(1)}`);
    expect(item.textContent).toContain("weight 100 %");
    expect(screen.getByTestId("attempt-summary").textContent).toContain("kWh");
  });

  it("gives each verdict its words", () => {
    const f = feedbackFromRuns(drill, controller, [], SEED).feedback[0];
    render(<WindowFeedbackList windows={(["better", "close", "worse"] as const).map((v, i) => ({ ...f, windowId: `w${i}`, verdict: v, finding: `finding ${v}`, hint: `hint ${v}` }))} />);
    expect(screen.getAllByTestId("window-verdict").map((e) => e.textContent)).toEqual(["better than the reference", "close to the reference", "worse than the reference"]);
    expect(screen.getByText("finding worse")).toBeTruthy();
    expect(screen.getByText("hint close")).toBeTruthy();
  });
});

describe("ActionLogList", () => {
  const pid = controllerConfigSchema.parse({ kc: 4, ti: 300, td: 0, sampleTimeS: 1 });
  it("words every action type", () => {
    expect(describeAction({ sample: 1, type: "setpoint", setpointC: 60 })).toBe("SP 60.0 °C");
    expect(describeAction({ sample: 1, type: "mode", mode: "manual" })).toBe("to manual");
    expect(describeAction({ sample: 1, type: "mode", mode: "auto" })).toBe("to auto");
    expect(describeAction({ sample: 1, type: "manual-output", outPercent: 35 })).toBe("manual OUT 35 %");
    expect(describeAction({ sample: 1, type: "tuning", controller: { ...pid, kc: 6, ti: 240 } }, pid)).toBe("Kc 4 → 6 %/°C, Ti 300 s → 240 s");
    expect(describeAction({ sample: 1, type: "tuning", controller: { ...pid, kind: "onoff", outOnPct: 60, outOffPct: 20, hysteresisC: 0.4 } }, pid)).toBe("relay test: on/off 60 % / 20 %, hysteresis 0.4 °C");
    expect(describeAction({ sample: 1, type: "tuning", controller: pid }, { ...pid, kind: "onoff" })).toBe("relay test ended: PID Kc 4 %/°C, Ti 300 s");
    expect(describeAction({ sample: 1, type: "cutout-reset" })).toBe("cutout reset");
    expect(describeAction({ sample: 1, type: "disturbance", event: { type: "door-open", durationS: 90 } })).toBe("disturbance: door opened for 1:30");
    expect(describeAction({ sample: 1, type: "disturbance", event: { type: "inlet-blockage", percent: 50 } })).toBe("disturbance: inlet 50 % blocked");
  });

  it("lists sample index, time and words, the tuning diffed against the controller in force", () => {
    render(
      <ActionLogList
        controller={pid as unknown as Record<string, unknown>}
        sampleTimeS={1}
        actions={[
          { sample: 90, type: "tuning", controller: { ...pid, kc: 6 } },
          { sample: 150, type: "tuning", controller: { ...pid, kc: 6, ti: 240 } },
          { sample: 200, type: "manual-output", outPercent: 35 },
        ]}
      />,
    );
    const items = screen.getAllByTestId("action-log-item").map((e) => e.textContent);
    expect(items[0]).toBe("#901:30Kc 4 → 6 %/°C");
    expect(items[1]).toBe("#1502:30Ti 300 s → 240 s");
    expect(items[2]).toBe("#2003:20manual OUT 35 %");
  });
});

describe("AttemptStatusBadge", () => {
  it("words each status", () => {
    for (const [s, t] of [["started", "started"], ["verifying", "verifying…"], ["verified", "verified"], ["failed", "failed"]] as const) {
      const { unmount } = render(<AttemptStatusBadge status={s} />);
      expect(screen.getByTestId("attempt-status").textContent).toBe(t);
      unmount();
    }
  });
});
