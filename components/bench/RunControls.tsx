"use client";
import type { BenchSpeed } from "@/sim/worker/protocol";
import { formatElapsed } from "@/components/trend/format";

export const BENCH_SPEEDS: { value: BenchSpeed; label: string }[] = [
  { value: 1, label: "×1" },
  { value: 10, label: "×10" },
  { value: 60, label: "×60" },
  { value: 600, label: "×600" },
  { value: "max", label: "max" },
];

export function RunControls({
  status,
  speed,
  timeS,
  seed,
  engineVersion,
  allowedSpeeds,
  pauseAllowed = true,
  onRun,
  onPause,
  onStep,
  onReset,
}: {
  status: "loading" | "paused" | "running";
  speed: BenchSpeed;
  timeS: number;
  seed: number;
  engineVersion: string;
  allowedSpeeds?: BenchSpeed[];
  pauseAllowed?: boolean;
  onRun: (speed: BenchSpeed) => void;
  onPause: () => void;
  onStep: () => void;
  onReset: () => void;
}) {
  const running = status === "running";
  const speeds = BENCH_SPEEDS.filter((s) => !allowedSpeeds || allowedSpeeds.includes(s.value));
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-sm border border-rule bg-paper-raised px-4 py-2.5 text-sm" role="toolbar" aria-label="Run controls">
      <button
        type="button"
        onClick={() => (running ? onPause() : onRun(speed))}
        disabled={status === "loading" || (running && !pauseAllowed)}
        className="w-20 rounded-sm bg-ink px-3 py-1.5 font-semibold text-paper disabled:opacity-50"
        aria-keyshortcuts="Space"
      >
        {running ? "Pause" : "Run"}
      </button>
      <button type="button" onClick={onStep} disabled={running} className="rounded-sm border border-rule-strong px-2.5 py-1.5 hover:border-ink disabled:opacity-40" aria-keyshortcuts=".">
        Step
      </button>
      <button type="button" onClick={onReset} className="rounded-sm border border-rule-strong px-2.5 py-1.5 hover:border-ink">
        Reset
      </button>
      <span className="flex gap-1" role="group" aria-label="Speed">
        {speeds.map((s) => (
          <button
            key={String(s.value)}
            type="button"
            aria-pressed={speed === s.value}
            onClick={() => onRun(s.value)}
            className={`num rounded-sm border px-2 py-1 ${speed === s.value ? "border-ink bg-ink text-paper" : "border-rule-strong hover:border-ink"}`}
          >
            {s.label}
          </button>
        ))}
      </span>
      <span className="num ml-auto text-ink-soft" data-testid="sim-time">
        sim {formatElapsed(timeS)} · seed {seed} · engine {engineVersion || "…"}
      </span>
    </div>
  );
}
