"use client";
/**
 * Review of one attempt: header, the trend replayed in the browser from the attempt's inputs (with
 * an optional second attempt overlaid), the action log on the timeline and as a list, the results
 * per scoring window with the automatic feedback, and the written feedback.
 */
import { useEffect, useMemo, useRef, type ReactNode } from "react";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import type { AttemptDetail } from "@/app/_lib/classroom/contracts";
import { traceColors } from "@/tailwind.config";
import { decimateMinMax } from "@/components/trend/decimate";
import { formatElapsed } from "@/components/trend/format";
import type { TraceBuffer } from "@/components/bench/trace-buffer";
import { AttemptStatusBadge } from "./AttemptStatusBadge";
import { ActionLogList, actionLines, type ActionLine } from "./ActionLogList";
import { WindowFeedbackList } from "./WindowFeedbackList";
import { useAttemptReplay, type AttemptReplay, type ReplayInputs, type WorkerFactory } from "./use-attempt-replay";

export interface AttemptReviewProps {
  attempt: AttemptDetail;
  compareWith?: AttemptDetail | null;
  compareOptions?: { id: string; label: string }[];
  /** the page's server-action form for written feedback */
  feedbackForm?: ReactNode;
  /** tests: the engine worker's factory */
  makeWorker?: WorkerFactory;
}

const INK = "#4b5258";
const RULE = "#e3e0d8";
const TICK = "#7c848a";
/** the compared attempt: a calm plum, distinct from every live trace colour */
const COMPARE = "#6b4a8f";

const stamp = (iso: string | null, timeZone: string) => {
  if (!iso) return "—";
  try {
    return new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone }).format(new Date(iso));
  } catch {
    return new Date(iso).toUTCString();
  }
};

const inputsOf = (a: AttemptDetail | null | undefined): ReplayInputs | null =>
  a && a.controller ? { drill: a.drill, controller: a.controller, seed: a.seed, actionLog: a.actionLog } : null;

const sampleTimeOf = (a: AttemptDetail) => (typeof a.controller?.sampleTimeS === "number" ? (a.controller.sampleTimeS as number) : 0.1);

function ReplayChart({ main, other, otherLabel, ticks }: { main: TraceBuffer; other: TraceBuffer | null; otherLabel: string; ticks: ActionLine[] }) {
  const hostT = useRef<HTMLDivElement>(null);
  const hostO = useRef<HTMLDivElement>(null);
  const plots = useRef<{ temp: uPlot; out: uPlot } | null>(null);
  const exportPng = () => {
    const p = plots.current;
    if (!p?.temp.ctx || !p.out.ctx) return;
    const a = p.temp.ctx.canvas;
    const b = p.out.ctx.canvas;
    const canvas = document.createElement("canvas");
    canvas.width = Math.max(a.width, b.width);
    canvas.height = a.height + b.height;
    const ctx = canvas.getContext("2d");
    if (!ctx) return;
    ctx.fillStyle = "#fbfaf7";
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(a, 0, 0);
    ctx.drawImage(b, 0, a.height);
    const link = document.createElement("a");
    link.href = canvas.toDataURL("image/png");
    link.download = "loopwright-attempt-trend.png";
    link.click();
  };
  useEffect(() => {
    if (!hostT.current || !hostO.current || main.length < 2) return;
    const c = main.columns;
    const n = main.length;
    const range = { fromX: c.timeS[0], toX: c.timeS[n - 1] };
    const d = decimateMinMax(c.timeS, [c.setpointC, c.pvRawC, c.pvFilteredC, c.trueC, c.outPercent], n, range, 700);
    let cmpPv: (number | null)[] = [];
    let cmpOut: (number | null)[] = [];
    if (other && other.length > 1) {
      const oc = other.columns;
      const dt = oc.timeS[1] - oc.timeS[0];
      const at = (arr: Float64Array) => d.x.map((x) => {
        const i = Math.round((x - oc.timeS[0]) / dt);
        return i >= 0 && i < other.length ? arr[i] : null;
      });
      cmpPv = at(oc.pvFilteredC);
      cmpOut = at(oc.outPercent);
    }
    const width = hostT.current.clientWidth || 800;
    const drawTicks = (u: uPlot) => {
      const ctx = u.ctx;
      const { top, height, left, width: w } = u.bbox;
      ctx.save();
      ctx.strokeStyle = TICK;
      ctx.lineWidth = devicePixelRatio;
      for (const t of ticks) {
        const x = u.valToPos(t.timeS, "x", true);
        if (x < left || x > left + w) continue;
        ctx.beginPath();
        ctx.moveTo(x, top);
        ctx.lineTo(x, top + 6 * devicePixelRatio);
        ctx.moveTo(x, top + height - 6 * devicePixelRatio);
        ctx.lineTo(x, top + height);
        ctx.stroke();
      }
      ctx.restore();
    };
    const xAxis: uPlot.Axis = { stroke: INK, grid: { stroke: RULE, width: 1 }, ticks: { stroke: RULE }, values: (_u, v) => v.map(formatElapsed), font: "11px var(--font-plex-mono), monospace" };
    const fmtT = (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(2)} °C`);
    const fmtO = (_u: uPlot, v: number | null) => (v == null ? "—" : `${v.toFixed(1)} %`);
    const sync = uPlot.sync?.("attempt-review");
    const cursor = sync ? { sync: { key: sync.key } } : {};
    const hasOther = !!other && other.length > 1;
    const temp = new uPlot(
      {
        width,
        height: 260,
        scales: { x: { time: false } },
        axes: [{ ...xAxis, show: false }, { stroke: INK, grid: { stroke: RULE, width: 1 }, ticks: { stroke: RULE }, font: "11px var(--font-plex-mono), monospace", label: "temperature °C", labelFont: "11px var(--font-plex-sans)", size: 56 }],
        series: [
          { label: "time", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) },
          { label: "SP", stroke: traceColors.sp, dash: [6, 4], width: 1.25, value: fmtT },
          { label: "PV raw", stroke: `${traceColors.pv}66`, width: 1, value: fmtT, show: false },
          { label: "PV", stroke: traceColors.pvFiltered, width: 1.6, value: fmtT },
          { label: "true temp.", stroke: traceColors.truth, dash: [2, 3], width: 1.4, value: fmtT },
          ...(hasOther ? [{ label: `${otherLabel} · PV`, stroke: COMPARE, width: 1.3, dash: [5, 3], value: fmtT }] : []),
        ],
        cursor,
        hooks: { draw: [drawTicks] },
        legend: { live: true },
      },
      [d.x, ...d.series.slice(0, 4), ...(hasOther ? [cmpPv] : [])] as uPlot.AlignedData,
      hostT.current,
    );
    const out = new uPlot(
      {
        width,
        height: 120,
        scales: { x: { time: false }, y: { range: [0, 100] } },
        axes: [xAxis, { stroke: INK, grid: { stroke: RULE, width: 1 }, ticks: { stroke: RULE }, font: "11px var(--font-plex-mono), monospace", label: "OUT %", labelFont: "11px var(--font-plex-sans)", size: 56, splits: () => [0, 50, 100] }],
        series: [
          { label: "time", value: (_u, v) => (v == null ? "—" : formatElapsed(v)) },
          { label: "OUT", stroke: traceColors.out, width: 1.4, value: fmtO },
          ...(hasOther ? [{ label: `${otherLabel} · OUT`, stroke: COMPARE, width: 1.1, dash: [5, 3], value: fmtO }] : []),
        ],
        cursor,
        hooks: { draw: [drawTicks] },
        legend: { live: true },
      },
      [d.x, d.series[4], ...(hasOther ? [cmpOut] : [])] as uPlot.AlignedData,
      hostO.current,
    );
    plots.current = { temp, out };
    return () => {
      plots.current = null;
      temp.destroy();
      out.destroy();
    };
  }, [main, main.length, other, other?.length, otherLabel, ticks]);
  return (
    <div className="space-y-1" data-testid="attempt-trend">
      <div ref={hostT} className="lw-trend" />
      <div ref={hostO} className="lw-trend" />
      <p className="flex text-[11px] text-ink-faint">
        <span>Ticks at the top and bottom edges mark the operator&apos;s actions (listed below).</span>
        <button type="button" onClick={exportPng} className="ml-auto underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
          Export PNG
        </button>
      </p>
    </div>
  );
}

function ReplayStatus({ replay, official }: { replay: AttemptReplay; official: string | null }) {
  if (replay.status === "running")
    return (
      <p className="text-xs text-ink-faint" data-testid="replay-status">
        Replaying in your browser… <span className="num">{(replay.progress * 100).toFixed(0)} %</span>
      </p>
    );
  if (replay.status === "error")
    return (
      <p className="text-xs text-ink-soft" role="alert" data-testid="replay-status">
        The replay could not run: {replay.error}
      </p>
    );
  if (replay.status === "done" && official && replay.fingerprint === official)
    return (
      <p className="text-xs text-ok" data-testid="replay-match">
        replay matches the server&apos;s trace ✓ <span className="num text-ink-faint">{official}</span>
      </p>
    );
  if (replay.status === "done" && official)
    return (
      <p className="text-xs text-ink-soft" data-testid="replay-mismatch">
        This browser&apos;s replay differs from the server&apos;s trace (fingerprint <span className="num">{replay.fingerprint}</span> against <span className="num">{official}</span>); the official results are the server&apos;s.
      </p>
    );
  return null;
}

function CompareSelect({ options, current }: { options: { id: string; label: string }[]; current: string | null }) {
  const router = useRouter();
  const pathname = usePathname();
  const params = useSearchParams();
  return (
    <label className="flex items-center gap-2 text-xs text-ink-soft">
      <span>Compare with</span>
      <select
        value={current ?? ""}
        onChange={(e) => {
          const next = new URLSearchParams(params?.toString() ?? "");
          if (e.target.value) next.set("compare", e.target.value);
          else next.delete("compare");
          const q = next.toString();
          router.push(q ? `${pathname}?${q}` : pathname);
        }}
        className="rounded-sm border border-rule-strong bg-paper-raised px-2 py-0.5 text-sm text-ink"
        aria-label="Compare with another attempt"
      >
        <option value="">— none —</option>
        {options.map((o) => (
          <option key={o.id} value={o.id}>
            {o.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export function AttemptReview({ attempt, compareWith, compareOptions, feedbackForm, makeWorker }: AttemptReviewProps) {
  const a = attempt;
  const tz = a.assignment.timeZone;
  const staff = a.canReview;
  // replay identity: the inputs only (an SWR refresh that only adds the official results keeps it)
  const mainInputs = useMemo(() => inputsOf(a), [a.id, a.controller === null]); // eslint-disable-line react-hooks/exhaustive-deps
  const otherInputs = useMemo(() => inputsOf(compareWith), [compareWith?.id]); // eslint-disable-line react-hooks/exhaustive-deps
  const replay = useAttemptReplay(mainInputs, makeWorker);
  const otherReplay = useAttemptReplay(otherInputs, makeWorker);
  const h = sampleTimeOf(a);
  const buffer = replay.buffer;
  const done = replay.status === "done";
  const timeOf = (sample: number) => (buffer && sample < buffer.length ? buffer.columns.timeS[sample] : undefined);
  // keyed on the attempt, not the object: a polled refresh of the same attempt keeps the chart
  const ticks = useMemo(() => actionLines(a.actionLog ?? [], a.controller, h), [a.id, a.actionLog?.length, h]); // eslint-disable-line react-hooks/exhaustive-deps
  const otherLabel = compareWith ? `attempt ${compareWith.number} — ${compareWith.trainee.name}` : "";

  return (
    <article className="space-y-6" data-testid="attempt-review">
      <header className="space-y-1">
        <p className="text-xs uppercase tracking-wide text-ink-faint">{a.assignment.title}</p>
        <h1 className="flex flex-wrap items-center gap-3 text-xl font-semibold">
          <span>
            {a.trainee.name} — attempt <span className="num">{a.number}</span>
            <span className="text-sm font-normal text-ink-faint"> of {a.assignment.attemptLimit}</span>
          </span>
          <AttemptStatusBadge status={a.status} />
          {a.late ? <span className="rounded-sm border border-rule-strong px-1 text-xs font-normal text-ink-soft">late</span> : null}
          {staff && a.flagged ? (
            <span className="rounded-sm bg-alarm-soft px-1 text-xs font-normal text-alarm" data-testid="attempt-flagged">
              flagged
            </span>
          ) : null}
        </h1>
        <p className="flex flex-wrap gap-x-4 text-xs text-ink-soft">
          <span>submitted <span className="num">{stamp(a.submittedAt, tz)}</span></span>
          {a.verifiedAt ? <span>verified <span className="num">{stamp(a.verifiedAt, tz)}</span></span> : null}
          <span>drill version <span className="num">{a.drillVersion}</span></span>
          <span>seed <span className="num">{a.seed}</span></span>
          {a.official ? <span>engine <span className="num">{a.official.engineVersion}</span></span> : null}
        </p>
        {staff && a.flagged && a.flagReason ? (
          <p className="rounded-sm bg-alarm-soft px-2 py-1 text-sm text-alarm" data-testid="attempt-flag-reason">
            Flagged: {a.flagReason}
          </p>
        ) : null}
        {a.status === "verifying" ? <p className="text-sm text-ink-soft">The server is replaying this attempt; the official results appear here when it is done.</p> : null}
        {a.status === "failed" ? <p className="text-sm text-ink-soft">The server could not verify this attempt.</p> : null}
      </header>

      <section aria-label="Replayed trend" className="space-y-2 rounded-sm border border-rule bg-paper-raised p-4">
        <div className="flex flex-wrap items-center gap-3">
          <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Trend · replayed from the attempt&apos;s inputs</h2>
          {compareOptions && compareOptions.length ? (
            <span className="ml-auto">
              <CompareSelect options={compareOptions} current={compareWith?.id ?? null} />
            </span>
          ) : null}
        </div>
        {compareWith ? (
          <p className="flex flex-wrap items-center gap-3 text-xs text-ink-soft" data-testid="compare-legend">
            <span className="inline-block h-0.5 w-5" style={{ background: traceColors.pvFiltered }} /> attempt {a.number} — {a.trainee.name}
            <span className="inline-block h-0.5 w-5" style={{ background: COMPARE }} /> {otherLabel}
            {otherReplay.status === "running" ? <span className="text-ink-faint">replaying…</span> : null}
          </p>
        ) : null}
        <ReplayStatus replay={replay} official={a.official?.fingerprint ?? null} />
        {!a.controller ? <p className="text-sm text-ink-faint">Nothing to replay: the attempt was not submitted.</p> : null}
        {buffer && done ? <ReplayChart main={buffer} other={otherReplay.status === "done" ? otherReplay.buffer : null} otherLabel={otherLabel} ticks={ticks} /> : null}
      </section>

      {a.official && a.official.violations.length ? (
        <section aria-label="Rule violations" className="rounded-sm border border-caution bg-caution-soft p-3 text-sm text-caution">
          <h2 className="mb-1 text-xs font-semibold uppercase tracking-wide">Outside the drill&apos;s rules</h2>
          <ul className="list-disc pl-5">
            {a.official.violations.map((v, i) => (
              <li key={i}>{v}</li>
            ))}
          </ul>
        </section>
      ) : null}

      <section aria-label="Results" className="space-y-2">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Results per window · official replay</h2>
        {a.official ? <WindowFeedbackList windows={a.official.windows} summary={a.official.summary} /> : <p className="text-sm text-ink-faint">No official results yet.</p>}
      </section>

      <section aria-label="Action log" className="space-y-2">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">
          Action log · <span className="num">{(a.actionLog ?? []).length}</span> actions
        </h2>
        <ActionLogList actions={a.actionLog ?? []} controller={a.controller} sampleTimeS={h} timeOf={done ? timeOf : undefined} />
      </section>

      <section aria-label="Written feedback" className="space-y-3">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Written feedback</h2>
        {a.feedback.length === 0 ? <p className="text-sm text-ink-faint">No written feedback yet.</p> : null}
        <ul className="space-y-3">
          {a.feedback.map((f) => (
            <li key={f.id} className="rounded-sm border border-rule bg-paper-raised p-3" data-testid="feedback-note">
              <p className="mb-1 text-xs text-ink-faint">
                {f.authorName} · <span className="num">{stamp(f.createdAt, tz)}</span>
              </p>
              <p className="whitespace-pre-wrap text-sm">{f.body}</p>
            </li>
          ))}
        </ul>
        {feedbackForm ?? null}
      </section>
    </article>
  );
}
