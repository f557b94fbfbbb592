"use client";
/**
 * The drill builder: one drill version's document (the engine's drill format) edited section by
 * section, validated live with the engine's parseDrill, previewed with runDrill in the browser
 * under the reference tuning, and saved, published, versioned, duplicated and shared through
 * the server actions of app/(app)/drills/actions.ts (which validate again and decide who may).
 */
import { useActionState, useEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { useRouter } from "next/navigation";
import useSWR from "swr";
import type { ActionResult } from "@/app/_lib/action";
import { FormOutcome } from "@/components/forms/ActionForm";
import type { PlantListItem } from "@/db/bench-queries";
import type { DrillDetail, DrillVersionDocument } from "@/db/drill-queries";
import type { ControllerConfig } from "@/sim/control/config";
import { runDrill } from "@/sim/drill/run-drill";
import { parseDrill, type Drill, type DrillEvent, type ScoringWindow } from "@/sim/drill/schema";
import { SCORE_FORMULA } from "@/sim/drill/score";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { PLANT_PRESETS, findPreset } from "@/sim/plant/presets";
import { formatElapsed } from "@/components/trend/format";
import { Check, Choice, Num, Section } from "./fields";
import { PreviewChart, type PreviewMark, type PreviewSeries } from "./PreviewChart";
import { TimelineEditor, eventLabel } from "./TimelineEditor";
import { outputHoldingC } from "./starters";

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

export interface DrillBuilderActions {
  saveDraft: Action;
  publishDraft: Action;
  newDraftFromPublished: Action;
  duplicateDrill: Action;
  setDrillShared: Action;
  archiveDrill: Action;
}

const fetchJson = async (url: string) => {
  const res = await fetch(url);
  if (!res.ok) throw new Error((await res.json().catch(() => ({}))).error ?? `HTTP ${res.status}`);
  return res.json();
};

const dateFmt = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });
const fmt = (v: number | null | undefined, digits: number, unit: string) => (v == null || !Number.isFinite(v) ? "—" : `${v.toFixed(digits)} ${unit}`);

function plantDefinitionOf(plant: Drill["plant"]): PlantDefinition | null {
  if (plant.kind === "preset") return findPreset(plant.presetId)?.plant ?? null;
  return plant;
}

function describeEvent(e: DrillEvent): string {
  switch (e.type) {
    case "setpoint":
      return `SP ${e.setpointC} °C`;
    case "setpoint-ramp":
      return `SP ramp ${e.fromC}→${e.toC} °C`;
    case "mode":
      return `to ${e.mode}`;
    case "inlet-blockage":
      return `inlet ${e.percent} % blocked`;
    case "door-open":
      return "door open";
    case "ambient":
      return `ambient ${e.temperatureC} °C`;
    case "supply-voltage":
      return `supply ${e.percentOfNominal} %`;
    case "cold-load":
      return `cold load ${e.massKg} kg`;
    case "sensor-noise":
      return `noise +${e.extraNoiseSdMa} mA`;
    case "sensor-fault":
      return `${e.fault} (${e.target})`;
    default:
      return eventLabel((e as DrillEvent).type);
  }
}

/** Timeline marks for the preview: each event, and its end when it has a duration. */
function marksOf(events: readonly DrillEvent[]): PreviewMark[] {
  const marks: PreviewMark[] = [];
  for (const e of events) {
    marks.push({ timeS: e.timeS, label: describeEvent(e) });
    if ("durationS" in e && e.durationS && e.type !== "setpoint-ramp") marks.push({ timeS: e.timeS + e.durationS, label: `${eventLabel(e.type).toLowerCase()} ends` });
  }
  return marks.sort((a, b) => a.timeS - b.timeS);
}

interface Preview {
  series: PreviewSeries;
  marks: PreviewMark[];
  windows: { startS: number; endS: number; label: string }[];
  results: { id: string; label: string; kind: string; overshootC: number | null; settlingTimeS: number | null; peakDeviationC: number | null; recoveryTimeS: number | null; iae: number }[];
  trips: number;
  energyKWh: number;
  forRevision: string;
}

function useOutcome(action: Action, onDone: (s: ActionResult) => void) {
  const [state, formAction] = useActionState(action, { ok: true } as ActionResult);
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    onDone(state);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state]);
  return formAction;
}

function ActionButton({ action, label, fields, disabled, tone = "quiet", title }: { action: (f: FormData) => void; label: string; fields: Record<string, string>; disabled?: boolean; tone?: "primary" | "quiet"; title?: string }) {
  const look = tone === "primary" ? "bg-ink text-paper hover:bg-ink-soft" : "border border-rule-strong bg-paper-raised text-ink hover:border-ink";
  return (
    <form action={action}>
      {Object.entries(fields).map(([k, v]) => (
        <input key={k} type="hidden" name={k} value={v} />
      ))}
      <button type="submit" disabled={disabled} title={title} className={`rounded-sm px-3 py-1.5 text-sm font-medium disabled:opacity-50 ${look}`}>
        {label}
      </button>
    </form>
  );
}

export function DrillBuilder({ drill: initialDrill, current, actions }: { drill: DrillDetail; current: DrillVersionDocument; actions: DrillBuilderActions }) {
  const router = useRouter();
  const { data, mutate } = useSWR<{ drill: DrillDetail }>(`/api/drills/${initialDrill.id}`, fetchJson, { fallbackData: { drill: initialDrill }, revalidateOnMount: true });
  useEffect(() => {
    void mutate();
  }, [initialDrill.updatedAt, initialDrill.latestVersion, mutate]);
  // the server's props and the SWR copy both refresh after an action: show whichever is newer
  const fetched = data?.drill;
  const drill = fetched && (fetched.updatedAt > initialDrill.updatedAt || (fetched.updatedAt === initialDrill.updatedAt && fetched.latestVersion >= initialDrill.latestVersion)) ? fetched : initialDrill;
  const canEdit = drill.mine && !drill.archivedAt;
  const { data: plantData } = useSWR<{ plants: PlantListItem[] }>("/api/plants", fetchJson);
  const storedPlants = (plantData?.plants ?? []).filter((p) => p.source !== "preset");

  // a new version, a publish or a save elsewhere replaces the edited document (sharing does not)
  const stamp = `${current.version}:${current.status}:${JSON.stringify(current.document)}`;
  const [doc, setDoc] = useState<Drill>(current.document);
  const [timelineValid, setTimelineValid] = useState(true);
  const [timelineKey, setTimelineKey] = useState(0);
  const [outcome, setOutcome] = useState<ActionResult>({ ok: true });
  const [preview, setPreview] = useState<Preview | null>(null);
  const [previewState, setPreviewState] = useState<{ running: boolean; error: string | null }>({ running: false, error: null });
  useEffect(() => {
    setDoc(current.document);
    setTimelineKey((k) => k + 1);
    setTimelineValid(true);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [stamp]);

  const afterAction = (s: ActionResult) => {
    setOutcome(s);
    void mutate();
    const version = (s as ActionResult & { version?: number }).version;
    if (s.ok && version !== undefined && version !== current.version) router.replace(`/drills/${drill.id}`);
    else router.refresh();
  };
  const save = useOutcome(actions.saveDraft, afterAction);
  const publish = useOutcome(actions.publishDraft, afterAction);
  const newDraft = useOutcome(actions.newDraftFromPublished, afterAction);
  const duplicate = useOutcome(actions.duplicateDrill, afterAction);
  const share = useOutcome(actions.setDrillShared, afterAction);
  const archive = useOutcome(actions.archiveDrill, afterAction);

  const checked = useMemo(() => parseDrill(doc), [doc]);
  const problems = checked.ok ? [] : checked.errors;
  const dirty = useMemo(() => JSON.stringify(doc) !== JSON.stringify(current.document), [doc, current.document]);
  const latestVersion = drill.latestVersion;
  const draftVersion = drill.draftVersion;
  const viewingFrozen = current.status === "published";
  const saveTarget = draftVersion ?? latestVersion + 1;
  const saveBlocked = !canEdit ? "Only the owner edits this drill." : !timelineValid ? "Fix the timeline first." : problems.length ? "Fix the problems listed first." : null;

  const set = (change: Partial<Drill>) => setDoc((d) => ({ ...d, ...change }));
  const setInitial = (change: Partial<Drill["initialState"]>) => setDoc((d) => ({ ...d, initialState: { ...d.initialState, ...change } }));
  const setTuning = (change: Partial<ControllerConfig>) => setDoc((d) => ({ ...d, referenceTuning: { ...d.referenceTuning, ...change } }));
  const setScoring = (change: Partial<Drill["scoring"]>) => setDoc((d) => ({ ...d, scoring: { ...d.scoring, ...change } }));
  const setWindow = (i: number, change: Partial<ScoringWindow>) => setScoring({ windows: doc.scoring.windows.map((w, j) => (j === i ? { ...w, ...change } : w)) });
  const rt = doc.referenceTuning;
  const def = plantDefinitionOf(doc.plant);

  const plantKey = doc.plant.kind === "preset" ? `preset:${doc.plant.presetId}` : (storedPlants.find((p) => JSON.stringify(p.definition) === JSON.stringify(doc.plant))?.ref ?? "inline");
  const choosePlant = (key: string) => {
    if (key.startsWith("preset:")) {
      set({ plant: { kind: "preset", presetId: key.slice(7) }, cutout: undefined, sensor: undefined });
      return;
    }
    const p = storedPlants.find((x) => x.ref === key);
    if (!p) return;
    set({ plant: p.definition, cutout: doc.cutout ?? { enabled: true, tripPointC: 120, sensorTimeConstantS: 10, resetMarginC: 5 } });
  };

  const runPreview = () => {
    if (!checked.ok) return;
    setPreviewState({ running: true, error: null });
    const drillNow = checked.drill;
    setTimeout(() => {
      try {
        const run = runDrill(drillNow);
        const t = run.trace;
        setPreview({
          series: { timeS: t.timeS, pvFilteredC: t.pvFilteredC, trueC: t.trueC, setpointC: t.setpointC, outPercent: t.outPercent, length: t.length },
          marks: marksOf(drillNow.events),
          windows: drillNow.scoring.windows.map((w) => ({ startS: w.startS, endS: w.endS, label: w.label ?? w.id })),
          results: run.results.windows.map((w) => ({
            id: w.id,
            label: w.label,
            kind: w.kind,
            overshootC: w.trueTemperature.overshootC,
            settlingTimeS: w.trueTemperature.settlingTimeS,
            peakDeviationC: w.trueTemperature.peakDeviationC,
            recoveryTimeS: w.trueTemperature.recoveryTimeS,
            iae: w.trueTemperature.iae,
          })),
          trips: run.results.safetyTrips.length,
          energyKWh: run.results.heaterEnergyKWh,
          forRevision: JSON.stringify(drillNow),
        });
        setPreviewState({ running: false, error: null });
      } catch (err) {
        setPreviewState({ running: false, error: err instanceof Error ? err.message : String(err) });
      }
    }, 10);
  };
  const previewStale = preview !== null && checked.ok && preview.forRevision !== JSON.stringify(checked.drill);

  const statusLine = (
    <span className="num text-xs text-ink-faint">
      v{current.version} · {current.status === "published" ? `published ${current.publishedAt ? dateFmt.format(new Date(current.publishedAt)) : ""} · frozen` : "draft"}
      {drill.sharedWithOrg ? " · shared in the organisation" : " · private"}
      {drill.archivedAt ? " · archived" : ""}
      {!drill.mine ? ` · owner ${drill.ownerName}` : ""}
    </span>
  );

  return (
    <div className="space-y-4" data-testid="drill-builder">
      <header className="space-y-2">
        <p className="text-xs uppercase tracking-wide text-ink-faint">Drill builder</p>
        <div className="flex flex-wrap items-baseline justify-between gap-3">
          <input
            aria-label="Drill title"
            value={doc.title}
            disabled={!canEdit}
            onChange={(e) => set({ title: e.target.value })}
            className="min-w-80 flex-1 rounded-sm border border-transparent bg-transparent px-1 py-0.5 text-xl font-semibold hover:border-rule focus:border-rule-strong disabled:text-ink"
          />
          {statusLine}
        </div>
        <div className="flex flex-wrap items-center gap-2">
          {canEdit ? (
            <ActionButton
              action={save}
              tone="primary"
              label={draftVersion !== null ? `Save draft v${saveTarget}` : `Save as draft v${saveTarget}`}
              fields={{ drillId: drill.id, payload: JSON.stringify(doc) }}
              disabled={saveBlocked !== null || !dirty}
              title={saveBlocked ?? (dirty ? undefined : "No unsaved changes.")}
            />
          ) : null}
          {canEdit && draftVersion !== null ? (
            <ActionButton
              action={publish}
              label={`Publish v${draftVersion}`}
              fields={{ drillId: drill.id }}
              disabled={dirty || current.version !== draftVersion}
              title={
                dirty
                  ? "Save the draft first: publishing freezes what is saved."
                  : current.version !== draftVersion
                    ? `Open draft v${draftVersion} (Versions) to publish it.`
                    : `Freezes version ${draftVersion}; attempts will run exactly this document.`
              }
            />
          ) : null}
          {canEdit && draftVersion === null ? <ActionButton action={newDraft} label={`New version (v${latestVersion + 1})`} fields={{ drillId: drill.id }} disabled={dirty} title="Opens a draft copying the latest published version." /> : null}
          <ActionButton action={duplicate} label="Duplicate" fields={{ drillId: drill.id }} title="A new drill of your own from the latest version." />
          {drill.mine && !drill.archivedAt ? (
            <ActionButton action={share} label={drill.sharedWithOrg ? "Stop sharing" : "Share with instructors"} fields={{ drillId: drill.id, shared: String(!drill.sharedWithOrg) }} />
          ) : null}
          {drill.mine ? <ActionButton action={archive} label={drill.archivedAt ? "Restore" : "Archive"} fields={{ drillId: drill.id, archived: String(!drill.archivedAt) }} /> : null}
          {dirty ? <span className="text-xs text-caution">Unsaved changes</span> : null}
        </div>
        <FormOutcome state={outcome} />
        {viewingFrozen && canEdit ? (
          <p className="text-xs text-ink-soft">Version {current.version} is published and frozen. Changes you save here become draft version {saveTarget}.</p>
        ) : null}
        {problems.length ? (
          <div role="alert" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-xs text-alarm" data-testid="drill-problems">
            <p className="font-medium">The drill is not valid yet:</p>
            <ul className="list-disc pl-4">
              {problems.slice(0, 6).map((p) => (
                <li key={p} className="num">
                  {p}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </header>

      <div className="grid gap-6 xl:grid-cols-[22rem_minmax(0,1fr)_16rem]">
        <fieldset disabled={!canEdit} className="min-w-0 space-y-4">
          <Section title="Scenario">
            <label className="block text-sm">
              <span className="mb-1 block text-ink-soft">Briefing shown to the trainee</span>
              <textarea value={doc.description} onChange={(e) => set({ description: e.target.value })} rows={4} className="w-full rounded-sm border border-rule-strong bg-paper px-2 py-1 text-sm" />
            </label>
            <Num label="Drill length" unit={`s (${formatElapsed(doc.durationS)})`} value={doc.durationS} onValue={(v) => set({ durationS: v ?? Number.NaN })} />
          </Section>

          <Section title="Plant">
            <div className="flex items-center justify-between gap-2 text-sm">
              <label htmlFor="drill-plant" className="text-ink-soft">
                Plant
              </label>
              <select id="drill-plant" value={plantKey} onChange={(e) => choosePlant(e.target.value)} className="w-48 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-sm">
                <optgroup label="Presets">
                  {PLANT_PRESETS.map((p) => (
                    <option key={p.id} value={`preset:${p.id}`}>
                      {p.title}
                    </option>
                  ))}
                </optgroup>
                {storedPlants.length ? (
                  <optgroup label="Stored plants">
                    {storedPlants.map((p) => (
                      <option key={p.ref} value={p.ref}>
                        {p.title}
                        {p.source === "shared" ? ` (${p.ownerName})` : ""}
                      </option>
                    ))}
                  </optgroup>
                ) : null}
                {plantKey === "inline" ? <option value="inline">Defined in this drill{"name" in doc.plant && doc.plant.name ? `: ${doc.plant.name}` : ""}</option> : null}
              </select>
            </div>
            {doc.plant.kind === "preset" ? <p className="text-xs text-ink-faint">{findPreset(doc.plant.presetId)?.description}</p> : <p className="text-xs text-ink-faint">A plant in full ({doc.plant.kind}): the drill carries its own copy.</p>}
            <Num
              label="Cutout trip point"
              unit="°C"
              optional={doc.plant.kind === "preset"}
              placeholder={doc.plant.kind === "preset" ? `${findPreset(doc.plant.presetId)?.cutoutTripC ?? ""}` : undefined}
              value={doc.cutout?.tripPointC}
              onValue={(v) => set({ cutout: v === undefined ? undefined : { enabled: true, sensorTimeConstantS: 10, resetMarginC: 5, ...doc.cutout, tripPointC: v } })}
              hint="Excess-temperature cutout, independent of the controller; empty = the preset's"
            />
            <Choice
              label="Final element"
              value={doc.drive.kind}
              options={[["time-proportioning", "time-proportioning SSR"], ["continuous", "continuous drive"]]}
              onChange={(kind) => set({ drive: kind === "continuous" ? { kind } : { kind, cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 } })}
            />
            {doc.drive.kind === "time-proportioning" ? (
              <Num label="Cycle time" unit="s" value={doc.drive.cycleTimeS} onValue={(v) => set({ drive: { ...(doc.drive as Extract<Drill["drive"], { kind: "time-proportioning" }>), cycleTimeS: v ?? Number.NaN } })} />
            ) : null}
          </Section>

          <Section title="Initial state">
            <Choice
              label="Temperatures"
              value={doc.initialState.temperatures.kind}
              options={[["steady", "steady at an OUT"], ["ambient", "at ambient"], ["temperatures", "air temperature given"]]}
              onChange={(kind) =>
                setInitial({
                  temperatures: kind === "steady" ? { kind, outPercent: doc.initialState.outPercent ?? 25 } : kind === "temperatures" ? { kind, airC: doc.initialState.setpointC } : { kind },
                })
              }
            />
            {doc.initialState.temperatures.kind === "steady" ? (
              <Num label="Steady at OUT" unit="%" value={doc.initialState.temperatures.outPercent} onValue={(v) => setInitial({ temperatures: { kind: "steady", outPercent: v ?? Number.NaN } })} />
            ) : null}
            {doc.initialState.temperatures.kind === "temperatures" ? (
              <Num label="Air temperature" unit="°C" value={doc.initialState.temperatures.airC} onValue={(v) => setInitial({ temperatures: { kind: "temperatures", airC: v ?? Number.NaN } })} />
            ) : null}
            <Choice label="Mode" value={doc.initialState.mode} options={[["auto", "auto"], ["manual", "manual"]]} onChange={(mode) => setInitial({ mode })} />
            <Num label="SP" unit="°C" value={doc.initialState.setpointC} onValue={(v) => setInitial({ setpointC: v ?? Number.NaN })} />
            <Num label="Initial OUT" unit="%" optional value={doc.initialState.outPercent} onValue={(v) => setInitial({ outPercent: v })} hint="empty: the steady output, else 0 %" />
            {def && canEdit ? (
              <button
                type="button"
                className="text-xs text-ink-soft underline decoration-rule-strong hover:text-ink"
                onClick={() => {
                  const out = outputHoldingC(def, doc.initialState.setpointC);
                  setInitial({ temperatures: { kind: "steady", outPercent: out }, outPercent: out });
                }}
              >
                Start steady at the SP (OUT that holds it)
              </button>
            ) : null}
          </Section>

          <Section title="Reference tuning">
            <Choice label="Controller" value={rt.kind} options={[["pid", "PID"], ["onoff", "on/off"]]} onChange={(kind) => setTuning({ kind })} />
            {rt.kind === "pid" ? (
              <>
                <Choice label="Form" value={rt.form} options={[["standard", "standard (ideal)"], ["parallel", "parallel"], ["series", "series (interacting)"]]} onChange={(form) => setTuning({ form })} />
                <Num label={rt.form === "parallel" ? "Gain Kp" : "Gain Kc"} unit="%/°C" value={rt.kc} onValue={(v) => setTuning({ kc: v ?? Number.NaN })} />
                {rt.form === "parallel" ? (
                  <>
                    <Num label="Integral gain Ki" unit="%/(°C·s)" value={rt.ki} onValue={(v) => setTuning({ ki: v ?? Number.NaN })} />
                    <Num label="Derivative gain Kd" unit="%·s/°C" value={rt.kd} onValue={(v) => setTuning({ kd: v ?? Number.NaN })} />
                  </>
                ) : (
                  <>
                    <Num label="Integral Ti" unit="s" value={rt.ti} onValue={(v) => setTuning({ ti: v ?? Number.NaN })} hint="0 = no integral action" />
                    <Num label="Derivative Td" unit="s" value={rt.td} onValue={(v) => setTuning({ td: v ?? Number.NaN })} hint="0 = no derivative action" />
                  </>
                )}
                <Num label="Derivative filter N" unit="" value={rt.derivativeFilterN} onValue={(v) => setTuning({ derivativeFilterN: v ?? Number.NaN })} />
                <Choice label="Anti-windup" value={rt.antiWindup} options={[["back-calculation", "back-calculation"], ["conditional", "conditional"], ["none", "none"]]} onChange={(antiWindup) => setTuning({ antiWindup })} />
              </>
            ) : (
              <Num label="Hysteresis" unit="°C" value={rt.hysteresisC} onValue={(v) => setTuning({ hysteresisC: v ?? Number.NaN })} />
            )}
            <Choice label="Action" value={rt.action} options={[["reverse", "reverse (heating)"], ["direct", "direct (cooling)"]]} onChange={(action) => setTuning({ action })} />
            <Num label="PV filter τf" unit="s" value={rt.pvFilterTauS} onValue={(v) => setTuning({ pvFilterTauS: v ?? Number.NaN })} hint="0 = off" />
            <Num label="Sample time" unit="s" value={rt.sampleTimeS} onValue={(v) => setTuning({ sampleTimeS: v ?? Number.NaN })} />
            <Num label="OUT low limit" unit="%" value={rt.outMinPct} onValue={(v) => setTuning({ outMinPct: v ?? Number.NaN })} />
            <Num label="OUT high limit" unit="%" value={rt.outMaxPct} onValue={(v) => setTuning({ outMaxPct: v ?? Number.NaN })} />
            <p className="text-xs text-ink-faint">Scores are relative to this tuning (it scores 50). Its sample time is the drill&apos;s unless trainees may change it.</p>
          </Section>
        </fieldset>

        <div className="min-w-0 space-y-4">
          <Section title="Event timeline" aside={<span className="num text-xs text-ink-faint">{doc.events.length} {doc.events.length === 1 ? "event" : "events"} · 0 – {formatElapsed(doc.durationS)}</span>}>
            <TimelineEditor
              key={timelineKey}
              events={doc.events}
              durationS={Number.isFinite(doc.durationS) ? doc.durationS : 0}
              readOnly={!canEdit}
              onChange={(events, valid) => {
                setTimelineValid(valid);
                setDoc((d) => ({ ...d, events }));
              }}
            />
          </Section>

          <Section
            title="Preview under the reference tuning"
            aside={
              <button type="button" onClick={runPreview} disabled={!checked.ok || previewState.running} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1 text-sm hover:border-ink disabled:opacity-50">
                {previewState.running ? "Running…" : "Preview"}
              </button>
            }
          >
            {previewState.error ? <p role="alert" className="text-sm text-alarm">Preview failed: {previewState.error}</p> : null}
            {preview ? (
              <>
                {previewStale ? <p className="text-xs text-caution">The drill changed since this preview: press Preview again.</p> : null}
                <PreviewChart series={preview.series} marks={preview.marks} windows={preview.windows} fileName={`drill-${drill.id.slice(0, 8)}-v${current.version}-preview`} />
                <table className="w-full border-collapse text-xs" data-testid="preview-results">
                  <thead>
                    <tr className="border-b border-rule text-left text-ink-faint">
                      <th className="py-1 font-normal">Window</th>
                      <th className="py-1 text-right font-normal">Overshoot / peak dev.</th>
                      <th className="py-1 text-right font-normal">Settling / recovery</th>
                      <th className="py-1 text-right font-normal">IAE</th>
                    </tr>
                  </thead>
                  <tbody>
                    {preview.results.map((r) => (
                      <tr key={r.id} className="border-b border-rule">
                        <td className="py-1">
                          {r.label} <span className="text-ink-faint">({r.kind})</span>
                        </td>
                        <td className="num py-1 text-right">{r.kind === "setpoint" ? fmt(r.overshootC, 2, "°C") : fmt(r.peakDeviationC, 2, "°C")}</td>
                        <td className="num py-1 text-right">{r.kind === "setpoint" ? fmt(r.settlingTimeS, 0, "s") : fmt(r.recoveryTimeS, 0, "s")}</td>
                        <td className="num py-1 text-right">{fmt(r.iae, 1, "°C·s")}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
                <p className="num text-xs text-ink-faint">
                  heater energy {fmt(preview.energyKWh, 3, "kWh")} · cutout trips {preview.trips}
                </p>
              </>
            ) : (
              <p className="text-sm text-ink-faint">Press Preview to run the drill in your browser with the reference tuning (the same engine that scores attempts).</p>
            )}
          </Section>

          <fieldset disabled={!canEdit} className="min-w-0">
            <Section
              title="Scoring windows"
              aside={
                canEdit ? (
                <button
                  type="button"
                  className="text-xs text-ink-soft underline decoration-rule-strong hover:text-ink"
                  onClick={() => {
                    const start = doc.events.length ? doc.events[doc.events.length - 1].timeS : 0;
                    const id = `w${doc.scoring.windows.length + 1}`;
                    setScoring({ windows: [...doc.scoring.windows, { id, label: "", kind: "disturbance", startS: start, endS: doc.durationS, weight: 1 }] });
                  }}
                >
                  Add window
                </button>
                ) : null
              }
            >
              <table className="w-full border-collapse text-sm">
                <thead>
                  <tr className="border-b border-rule text-left text-xs text-ink-faint">
                    <th className="py-1 font-normal">Id</th>
                    <th className="py-1 font-normal">Label</th>
                    <th className="py-1 font-normal">Kind</th>
                    <th className="py-1 font-normal">From, s</th>
                    <th className="py-1 font-normal">To, s</th>
                    <th className="py-1 font-normal">Weight</th>
                    <th />
                  </tr>
                </thead>
                <tbody>
                  {doc.scoring.windows.map((w, i) => (
                    <tr key={i} className="border-b border-rule" data-testid="scoring-window">
                      <td className="py-1 pr-1">
                        <input aria-label={`Window ${i + 1} id`} value={w.id} onChange={(e) => setWindow(i, { id: e.target.value })} className="num w-20 rounded-sm border border-rule-strong bg-paper px-1 py-0.5" />
                      </td>
                      <td className="py-1 pr-1">
                        <input aria-label={`Window ${i + 1} label`} value={w.label ?? ""} onChange={(e) => setWindow(i, { label: e.target.value })} className="w-full min-w-24 rounded-sm border border-rule-strong bg-paper px-1 py-0.5" />
                      </td>
                      <td className="py-1 pr-1">
                        <select aria-label={`Window ${i + 1} kind`} value={w.kind} onChange={(e) => setWindow(i, { kind: e.target.value as ScoringWindow["kind"] })} className="rounded-sm border border-rule-strong bg-paper px-1 py-0.5">
                          <option value="setpoint">SP step</option>
                          <option value="disturbance">disturbance</option>
                        </select>
                      </td>
                      {(["startS", "endS", "weight"] as const).map((k) => (
                        <td key={k} className="py-1 pr-1">
                          <WindowNumber label={`Window ${i + 1} ${k === "startS" ? "from" : k === "endS" ? "to" : "weight"}`} value={w[k]} onValue={(v) => setWindow(i, { [k]: v })} />
                        </td>
                      ))}
                      <td className="py-1 text-right">
                        <button type="button" aria-label={`Remove window ${i + 1}`} disabled={doc.scoring.windows.length === 1} onClick={() => setScoring({ windows: doc.scoring.windows.filter((_, j) => j !== i) })} className="text-xs text-ink-faint hover:text-alarm disabled:opacity-40">
                          Remove
                        </button>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <div className="grid gap-x-6 gap-y-1.5 sm:grid-cols-2">
                <Num label="Weight of IAE" unit="" value={doc.scoring.metricWeights.iae} onValue={(v) => setScoring({ metricWeights: { ...doc.scoring.metricWeights, iae: v ?? Number.NaN } })} />
                <Num label="Weight of overshoot / peak" unit="" value={doc.scoring.metricWeights.peak} onValue={(v) => setScoring({ metricWeights: { ...doc.scoring.metricWeights, peak: v ?? Number.NaN } })} />
                <Num label="Weight of settling / recovery" unit="" value={doc.scoring.metricWeights.time} onValue={(v) => setScoring({ metricWeights: { ...doc.scoring.metricWeights, time: v ?? Number.NaN } })} />
                <Num label="Settling band floor" unit="°C" value={doc.scoring.bandFloorC} onValue={(v) => setScoring({ bandFloorC: v ?? Number.NaN })} />
                <Num label="Penalty per cutout trip" unit="× score" value={doc.scoring.tripPenaltyFactor} onValue={(v) => setScoring({ tripPenaltyFactor: v ?? Number.NaN })} />
              </div>
              <p className="rounded-sm bg-paper-sunk px-3 py-2 text-xs text-ink-soft" data-testid="score-formula">
                <span className="font-medium">Score.</span> {SCORE_FORMULA}
              </p>
            </Section>
          </fieldset>
        </div>

        <div className="min-w-0 space-y-4">
          <fieldset disabled={!canEdit} className="space-y-4">
            <Section title="Trainees may change">
              <p className="text-xs text-ink-faint">Tuning (gains, times, form, anti-windup): always.</p>
              <Check label="PV filter" checked={doc.trainee.mayChange.pvFilter} onChange={(pvFilter) => set({ trainee: { ...doc.trainee, mayChange: { ...doc.trainee.mayChange, pvFilter } } })} />
              <Check label="Sample time" checked={doc.trainee.mayChange.sampleTime} onChange={(sampleTime) => set({ trainee: { ...doc.trainee, mayChange: { ...doc.trainee.mayChange, sampleTime } } })} />
              <Check label="Relay test allowed" checked={doc.trainee.relayTestAllowed} onChange={(relayTestAllowed) => set({ trainee: { ...doc.trainee, relayTestAllowed } })} />
              <Check label="Bump test allowed" checked={doc.trainee.bumpTestAllowed} onChange={(bumpTestAllowed) => set({ trainee: { ...doc.trainee, bumpTestAllowed } })} />
            </Section>
            <Section title="Pace">
              <SpeedsField speeds={doc.pace.speeds} onSpeeds={(speeds) => set({ pace: { ...doc.pace, speeds } })} />
              <Check label="Pause allowed" checked={doc.pace.pauseAllowed} onChange={(pauseAllowed) => set({ pace: { ...doc.pace, pauseAllowed } })} />
            </Section>
            <Section title="Noise seed">
              <Choice
                label="Policy"
                value={doc.noise.seedPolicy}
                options={[["fixed", "fixed: same seed for all"], ["per-attempt", "new seed per attempt"]]}
                onChange={(seedPolicy) => set({ noise: { ...doc.noise, seedPolicy } })}
              />
              <Num label={doc.noise.seedPolicy === "fixed" ? "Seed" : "Preview seed"} unit="" value={doc.noise.seed} onValue={(v) => set({ noise: { ...doc.noise, seed: v ?? Number.NaN } })} />
            </Section>
          </fieldset>
          <Section title="Versions">
            <VersionList drill={drill} currentVersion={current.version} />
          </Section>
        </div>
      </div>
    </div>
  );
}

function WindowNumber({ label, value, onValue }: { label: string; value: number; onValue: (v: number) => void }) {
  const [text, setText] = useState(String(value));
  useEffect(() => {
    setText((t) => (Number(t) === value || (t.trim() === "" && Number.isNaN(value)) ? t : String(value)));
  }, [value]);
  return (
    <input
      aria-label={label}
      inputMode="decimal"
      value={text}
      onChange={(e) => {
        setText(e.target.value);
        const t = e.target.value.trim();
        onValue(t === "" ? Number.NaN : Number(t));
      }}
      className="num w-16 rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-right"
    />
  );
}

function SpeedsField({ speeds, onSpeeds }: { speeds: number[]; onSpeeds: (s: number[]) => void }) {
  const [text, setText] = useState(speeds.join(", "));
  return (
    <label className="flex items-center justify-between gap-2 text-sm">
      <span className="text-ink-soft">Speeds offered</span>
      <span className="flex items-center gap-1.5">
        <input
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            onSpeeds(
              e.target.value
                .split(/[,\s]+/)
                .filter(Boolean)
                .map(Number),
            );
          }}
          className="num w-28 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-right"
        />
        <span className="num text-xs text-ink-faint">× real time</span>
      </span>
    </label>
  );
}

function VersionList({ drill, currentVersion }: { drill: DrillDetail; currentVersion: number }): ReactNode {
  return (
    <ol className="divide-y divide-rule border-y border-rule text-sm" data-testid="drill-versions">
      {drill.versions.map((v) => (
        <li key={v.version} className={`flex items-baseline justify-between gap-2 py-1.5 ${v.version === currentVersion ? "font-medium" : ""}`}>
          <a href={`/drills/${drill.id}?version=${v.version}`} className="num">
            v{v.version}
          </a>
          <span className={v.status === "published" ? "text-ink" : "text-caution"}>{v.status}</span>
          <span className="num text-xs text-ink-faint">{dateFmt.format(new Date(v.publishedAt ?? v.createdAt))}</span>
        </li>
      ))}
    </ol>
  );
}
