"use client";
/**
 * The site proof test, built inside the Bench's experiments panel: a setpoint ladder from the
 * working SP followed by the disturbances expected on site, or a published drill version moved
 * onto this plant. "Use" puts it in the Bench's store (siteProof), where the PI vs PID comparison
 * takes it from.
 */
import { useMemo, useState } from "react";
import useSWR from "swr";
import type { DrillListItem, DrillVersionDocument } from "@/db/drill-queries";
import { fetchJson } from "@/components/bench/plants/format";
import { useBench } from "@/components/bench/store";
import { drillSchema, type DrillInput } from "@/sim/drill/schema";
import { resolvePlant } from "@/sim/drill/resolve";
import { droppedEvents, drillOnPlant, ENCLOSURE_ONLY, lengthWarning, ladderDrill, ladderLabel, ladderProblem, reachWarnings, type LadderSpec, type SiteDisturbance } from "./proof-drill";
import { UnitRow } from "@/components/forms/UnitRow";

const num = (s: string) => Number(s.trim().replace(",", "."));
const small = "num w-16 rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-right text-xs";

type Row = { on: boolean; watchMin: string; a: string; b: string };
type Kind = SiteDisturbance["kind"];

/** Each disturbance the engine's timeline offers, with its two figures (label, unit, default). */
const KINDS: { kind: Kind; title: string; a: [string, string]; b: [string, string] | null }[] = [
  { kind: "inlet-blockage", title: "Air inlet blocked", a: ["blocked", "%"], b: ["for", "min"] },
  { kind: "door-open", title: "Door opened", a: ["for", "s"], b: null },
  { kind: "cold-load", title: "Cold load (aluminium parts)", a: ["mass", "kg"], b: ["at", "°C"] },
  { kind: "ambient", title: "Ambient change", a: ["to", "°C"], b: ["for", "min"] },
  { kind: "supply-voltage", title: "Supply voltage dip", a: ["to", "% of nominal"], b: ["for", "min"] },
];

function disturbanceOf(kind: Kind, r: Row): SiteDisturbance {
  const a = num(r.a);
  const b = num(r.b);
  switch (kind) {
    case "inlet-blockage":
      return { kind, percent: a, forS: b * 60 };
    case "door-open":
      return { kind, forS: a };
    case "cold-load":
      // aluminium (c ≈ 900 J/(kg·K)), coupled to the air like the Bench's own cold-load button
      return { kind, massKg: a, specificHeatJPerKgK: 900, temperatureC: b, airCouplingWPerK: 10 };
    case "ambient":
      return { kind, temperatureC: a, forS: b * 60 };
    case "supply-voltage":
      return { kind, percentOfNominal: a, forS: b * 60 };
  }
}

export function ProofTestBuilder({ baseDrill }: { baseDrill: DrillInput }) {
  const siteProof = useBench((s) => s.siteProof);
  const [source, setSource] = useState<"timeline" | "drill">("timeline");
  const def = useMemo(() => resolvePlant(drillSchema.parse(baseDrill)), [baseDrill]);
  const isEnclosure = def.kind === "enclosure";
  const sp0 = baseDrill.initialState.setpointC;
  const ambient = def.ambientC;
  const [startC, setStartC] = useState(String(sp0));
  const [leadMin, setLeadMin] = useState("2");
  const [steps, setSteps] = useState(`${sp0 + 10}, ${sp0 + 20}, ${sp0}`);
  const [holdMin, setHoldMin] = useState("30");
  const [rows, setRows] = useState<Record<Kind, Row>>({
    "inlet-blockage": { on: isEnclosure, watchMin: "30", a: "60", b: "10" },
    "door-open": { on: isEnclosure, watchMin: "20", a: "60", b: "" },
    "cold-load": { on: false, watchMin: "30", a: "5", b: "18" },
    ambient: { on: !isEnclosure, watchMin: "60", a: String(ambient - 5), b: "60" },
    "supply-voltage": { on: false, watchMin: "20", a: "90", b: "10" },
  });
  const [error, setError] = useState<string | null>(null);

  const takeTimeline = () => {
    const start = num(startC);
    const sps = steps.split(/[\s,;]+/).filter(Boolean).map(num);
    if (!Number.isFinite(start)) return setError("Working SP: a number of °C.");
    if (sps.some((v) => !Number.isFinite(v))) return setError("SP steps: numbers of °C, separated by commas.");
    if (sps.length > 12) return setError("At most 12 SP steps.");
    const hold = num(holdMin) * 60;
    const spec: LadderSpec = {
      startC: start,
      leadInS: num(leadMin) * 60,
      steps: sps.map((setpointC) => ({ setpointC, holdS: hold })),
      disturbances: KINDS.filter((k) => rows[k.kind].on).map((k) => ({ disturbance: disturbanceOf(k.kind, rows[k.kind]), holdS: num(rows[k.kind].watchMin) * 60 })),
    };
    const problem = ladderProblem(baseDrill, spec);
    if (problem) return setError(problem);
    try {
      const drill = ladderDrill(baseDrill, spec);
      setError(null);
      useBench.getState().set({ siteProof: { label: ladderLabel(baseDrill, spec), drill, drillVersion: null } });
    } catch (e) {
      setError(`This timeline does not make a valid drill: ${(e as Error).message}`);
    }
  };

  const setRow = (kind: Kind, patch: Partial<Row>) => setRows((r) => ({ ...r, [kind]: { ...r[kind], ...patch } }));
  const warnings = siteProof ? [...reachWarnings(siteProof.drill, baseDrill), lengthWarning(siteProof.drill)].filter((w): w is string => !!w) : [];

  return (
    <div className="space-y-2 rounded-sm border border-rule p-2 text-xs" data-testid="site-proof-builder">
      <div role="radiogroup" aria-label="Site proof test from" className="flex gap-3">
        <label className="flex items-center gap-1">
          <input type="radio" name="sp-source" checked={source === "timeline"} onChange={() => setSource("timeline")} /> a timeline built here
        </label>
        <label className="flex items-center gap-1">
          <input type="radio" name="sp-source" checked={source === "drill"} onChange={() => setSource("drill")} /> a stored drill
        </label>
      </div>

      <div hidden={source !== "timeline"} className="space-y-1.5">
        <UnitRow id="sp-start" label="Working SP" unit="°C">
          <input id="sp-start" inputMode="decimal" value={startC} onChange={(e) => setStartC(e.target.value)} className={small} />
        </UnitRow>
        <UnitRow id="sp-lead" label="Settled before the first step" unit="min">
          <input id="sp-lead" inputMode="decimal" value={leadMin} onChange={(e) => setLeadMin(e.target.value)} className={small} />
        </UnitRow>
        <UnitRow id="sp-steps" label="SP ladder" unit="°C">
          <input id="sp-steps" value={steps} onChange={(e) => setSteps(e.target.value)} className="num w-28 rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs" />
        </UnitRow>
        <UnitRow id="sp-hold" label="Hold each step" unit="min">
          <input id="sp-hold" inputMode="decimal" value={holdMin} onChange={(e) => setHoldMin(e.target.value)} className={small} />
        </UnitRow>
        <fieldset className="space-y-1 border-t border-rule pt-1.5">
          <legend className="text-ink-faint">Then, at the last SP, one after another</legend>
          {KINDS.map((k) => {
            const r = rows[k.kind];
            const idle = !isEnclosure && ENCLOSURE_ONLY.has(k.kind);
            const id = `sp-d-${k.kind}`;
            return (
              <div key={k.kind} className={idle ? "opacity-60" : ""}>
                <label className="flex items-center gap-1.5">
                  <input type="checkbox" checked={r.on && !idle} disabled={idle} onChange={(e) => setRow(k.kind, { on: e.target.checked })} />
                  <span>{k.title}</span>
                  {idle ? <span className="text-ink-faint">(needs a physical enclosure; a twin has none)</span> : null}
                </label>
                {r.on && !idle ? (
                  <div className="ml-5 mt-0.5 flex flex-wrap items-center gap-x-2 gap-y-1">
                    <Inline id={`${id}-a`} label={`${k.title}: ${k.a[0]}`} text={k.a[0]} unit={k.a[1]} value={r.a} onChange={(v) => setRow(k.kind, { a: v })} />
                    {k.b ? <Inline id={`${id}-b`} label={`${k.title}: ${k.b[0]}`} text={k.b[0]} unit={k.b[1]} value={r.b} onChange={(v) => setRow(k.kind, { b: v })} /> : null}
                    <Inline id={`${id}-w`} label={`${k.title}: watched for`} text="watch" unit="min" value={r.watchMin} onChange={(v) => setRow(k.kind, { watchMin: v })} />
                  </div>
                ) : null}
              </div>
            );
          })}
        </fieldset>
        <button type="button" onClick={takeTimeline} className="rounded-sm border border-ink px-2.5 py-1 font-semibold hover:bg-paper-sunk">
          Use this timeline
        </button>
      </div>

      <div hidden={source !== "drill"}>{source === "drill" ? <StoredDrillPicker baseDrill={baseDrill} onError={setError} /> : null}</div>

      {error ? (
        <p role="alert" className="text-alarm">
          {error}
        </p>
      ) : null}
      {siteProof ? (
        <div role="status" className="space-y-0.5 border-t border-rule pt-1.5" data-testid="site-proof-current">
          <p>
            <span className="text-ink-faint">In use: </span>
            {siteProof.label} <span className="num text-ink-faint">· {formatHours(siteProof.drill.durationS)}</span>
          </p>
          {siteProof.drillVersion ? <p className="text-ink-faint">Stored drill run on this plant: its plant, sensor chain, final element and cutout are this plant&apos;s; its timeline, scoring windows and seed are the drill&apos;s.</p> : null}
          {warnings.map((w) => (
            <p key={w} className="text-caution">
              {w}
            </p>
          ))}
        </div>
      ) : null}
    </div>
  );
}

const formatHours = (s: number) => (s >= 3600 ? `${Math.floor(s / 3600)} h ${Math.round((s % 3600) / 60)} min` : `${Math.round(s / 60)} min`);

function Inline({ id, label, text, unit, value, onChange }: { id: string; label: string; text: string; unit: string; value: string; onChange: (v: string) => void }) {
  return (
    <span className="flex items-center gap-1">
      <label htmlFor={id} className="text-ink-faint">
        <span aria-hidden="true">{text}</span>
        <span className="sr-only">{label}</span>
      </label>
      <input id={id} inputMode="decimal" value={value} onChange={(e) => onChange(e.target.value)} className="num w-12 rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-right text-xs" />
      <span className="num text-ink-faint">{unit}</span>
    </span>
  );
}

/** Published drill versions the user may view (instructors and admins), moved onto this plant. */
function StoredDrillPicker({ baseDrill, onError }: { baseDrill: DrillInput; onError: (msg: string | null) => void }) {
  const { data, error } = useSWR<{ drills: DrillListItem[] }>("/api/drills", fetchJson);
  const published = (data?.drills ?? []).filter((d) => d.publishedVersions.length > 0);
  const [drillId, setDrillId] = useState("");
  const [version, setVersion] = useState("");
  const [loading, setLoading] = useState(false);
  const chosen = published.find((d) => d.id === drillId) ?? published[0] ?? null;
  const versions = chosen ? [...chosen.publishedVersions].reverse() : [];
  const v = version && versions.includes(Number(version)) ? Number(version) : (versions[0] ?? null);

  const takeDrill = async () => {
    if (!chosen || v === null) return;
    setLoading(true);
    try {
      const { version: doc } = await fetchJson<{ version: DrillVersionDocument }>(`/api/drills/${chosen.id}/versions/${v}`);
      const dropped = droppedEvents(doc.document as DrillInput, baseDrill);
      const drill = drillOnPlant(doc.document as DrillInput, baseDrill);
      onError(dropped.length ? `Left out on this plant (it has no enclosure to answer them): ${[...new Set(dropped)].join(", ")}.` : null);
      useBench.getState().set({ siteProof: { label: `${chosen.title} v${v}`.slice(0, 80), drill, drillVersion: { drillId: chosen.id, version: v, title: chosen.title.slice(0, 200) } } });
    } catch (e) {
      onError(`That drill cannot be run on this plant: ${(e as Error).message}`);
    } finally {
      setLoading(false);
    }
  };

  if (error) return <p className="text-ink-soft">Stored drills are not available to this account ({String((error as Error).message)}): build a timeline here instead.</p>;
  if (!data) return <p className="text-ink-faint">Loading the drills…</p>;
  if (published.length === 0) return <p className="text-ink-soft">No published drill to take: build a timeline here instead.</p>;
  return (
    <div className="space-y-1.5">
      <UnitRow id="sp-drill" label="Stored drill" unit="">
        <select id="sp-drill" value={chosen?.id ?? ""} onChange={(e) => (setDrillId(e.target.value), setVersion(""))} className="max-w-44 rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs">
          {published.map((d) => (
            <option key={d.id} value={d.id}>
              {d.title}
            </option>
          ))}
        </select>
      </UnitRow>
      <UnitRow id="sp-version" label="Published version" unit="">
        <select id="sp-version" value={v ?? ""} onChange={(e) => setVersion(e.target.value)} className="rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs">
          {versions.map((n) => (
            <option key={n} value={n}>
              v{n}
            </option>
          ))}
        </select>
      </UnitRow>
      <p className="text-ink-faint">The drill runs on this plant: its plant, sensor chain, final element and cutout are replaced by this plant&apos;s; its timeline and scoring are kept. Check its setpoints suit this plant.</p>
      <button type="button" onClick={() => void takeDrill()} disabled={loading} className="rounded-sm border border-ink px-2.5 py-1 font-semibold hover:bg-paper-sunk disabled:opacity-50">
        {loading ? "Loading…" : "Use this drill"}
      </button>
    </div>
  );
}
