"use client";
// The plant editor: an enclosure described by what a technician knows (volume, walls, heater,
// airflow, contents, sensor), or a compact transfer-function model (FOPDT/SOPDT). Every keystroke
// is validated with the engine's own zod schema and the derived figures are recomputed with the
// engine's functions, so what is shown here is exactly what the Bench will simulate.
import { useActionState, useDeferredValue, useEffect, useId, useMemo, useState } from "react";
import { mutate } from "swr";
import type { z } from "zod";
import { savePlant, updatePlant, type SavedResult } from "@/app/(app)/bench/actions";
import type { ActionResult } from "@/app/_lib/action";
import { FormOutcome } from "@/components/forms/ActionForm";
import { derivedFigures, steadyStateTemperatureC, type DerivedFigures } from "@/sim/plant/derived-figures";
import { enclosureParamsSchema } from "@/sim/plant/enclosure-params";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { PLANT_PRESETS } from "@/sim/plant/presets";
import { transferFunctionParamsSchema } from "@/sim/plant/transfer-function-params";
import { Duration, Qty, formatNumber } from "./format";

type Kind = PlantDefinition["kind"];

interface FieldSpec {
  path: string;
  label: string;
  unit: string;
  hint?: string;
  /** may be left empty (then it is left out of the definition) */
  optional?: boolean;
}

interface Group {
  title: string;
  fields: FieldSpec[];
}

const ENCLOSURE_GROUPS: Group[] = [
  {
    title: "Enclosure",
    fields: [
      { path: "volumeM3", label: "Air volume", unit: "m³" },
      { path: "wallAreaM2", label: "Wall area", unit: "m²" },
      { path: "wallUValueWPerM2K", label: "Wall U-value", unit: "W/(m²·K)", hint: "air to ambient, both films included" },
      { path: "innerFilmCoefficientWPerM2K", label: "Inner film coefficient", unit: "W/(m²·K)" },
      { path: "outerFilmCoefficientWPerM2K", label: "Outer film coefficient", unit: "W/(m²·K)" },
      { path: "wallHeatCapacityJPerK", label: "Wall heat capacity", unit: "J/K", hint: "shell, shelves, frame" },
    ],
  },
  {
    title: "Heater",
    fields: [
      { path: "heaterRatingW", label: "Heater rating", unit: "W", hint: "at the nominal voltage" },
      { path: "nominalVoltageV", label: "Nominal voltage", unit: "V" },
      { path: "heaterHeatCapacityJPerK", label: "Element heat capacity", unit: "J/K" },
      { path: "heaterTimeConstantS", label: "Element time constant", unit: "s" },
    ],
  },
  {
    title: "Air and surroundings",
    fields: [
      { path: "inletAirflowM3PerH", label: "Inlet airflow", unit: "m³/h", hint: "0 = sealed" },
      { path: "doorOpenAirflowM3PerH", label: "Extra airflow, door open", unit: "m³/h" },
      { path: "ambientC", label: "Ambient", unit: "°C" },
      { path: "pressurePa", label: "Barometric pressure", unit: "Pa" },
    ],
  },
  {
    title: "Contents",
    fields: [
      { path: "contents.massKg", label: "Contents mass", unit: "kg" },
      { path: "contents.specificHeatJPerKgK", label: "Specific heat", unit: "J/(kg·K)" },
      { path: "contents.airCouplingWPerK", label: "Air-to-contents coupling h·A", unit: "W/K" },
    ],
  },
  {
    title: "Sensor",
    fields: [{ path: "sensorTimeConstantS", label: "Sensor element time constant", unit: "s", hint: "RTD in its sheath or thermowell" }],
  },
];

const NONLINEAR_FIELDS: FieldSpec[] = [
  { path: "nonlinear.convectionCoefficient", label: "Convection coefficient c", unit: "W/(m²·K^1.25)" },
  { path: "nonlinear.emissivity", label: "Skin emissivity ε", unit: "" },
];

const TRANSFER_FUNCTION_GROUPS: Group[] = [
  {
    title: "Model",
    fields: [
      { path: "gainCPerPercent", label: "Static gain K", unit: "°C/%" },
      { path: "timeConstantsS.0", label: "Time constant τ₁", unit: "s" },
      { path: "timeConstantsS.1", label: "Second time constant τ₂", unit: "s", hint: "empty for FOPDT", optional: true },
      { path: "deadTimeS", label: "Dead time θ", unit: "s" },
    ],
  },
  {
    title: "Operating point",
    fields: [
      { path: "operatingPoint.outPercent", label: "Output at the operating point", unit: "%" },
      { path: "operatingPoint.temperatureC", label: "Temperature at the operating point", unit: "°C" },
      { path: "ambientC", label: "Ambient during identification", unit: "°C" },
    ],
  },
  {
    title: "Heater and sensor",
    fields: [
      { path: "heaterRatingW", label: "Heater rating", unit: "W" },
      { path: "nominalVoltageV", label: "Nominal voltage", unit: "V" },
      { path: "sensorTimeConstantS", label: "Extra sensor lag", unit: "s", hint: "0 when the model includes it" },
    ],
  },
];

type Values = Record<string, string>;

function get(obj: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), obj);
}

function set(obj: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split(".");
  let o: Record<string, unknown> = obj;
  keys.slice(0, -1).forEach((k, i) => {
    o[k] ??= /^\d+$/.test(keys[i + 1]) ? [] : {};
    o = o[k] as Record<string, unknown>;
  });
  o[keys[keys.length - 1]] = value;
}

function valuesFrom(def: PlantDefinition, groups: Group[], extra: FieldSpec[] = []): Values {
  const out: Values = {};
  for (const f of [...groups.flatMap((g) => g.fields), ...extra]) {
    const v = get(def, f.path);
    out[f.path] = typeof v === "number" ? String(v) : "";
  }
  return out;
}

function defaultTransferFunction(from: PlantDefinition | null): PlantDefinition {
  let fit = { gainCPerPercent: 0.8, timeConstantS: 900, deadTimeS: 60 };
  let op = { outPercent: 50, temperatureC: 60 };
  let ambientC = 20;
  if (from?.kind === "enclosure") {
    try {
      const f = derivedFigures(from, 50);
      fit = f.fopdtFit;
      op = { outPercent: 50, temperatureC: Math.round(f.steadyStateC * 10) / 10 };
      ambientC = from.ambientC;
    } catch {
      /* keep the defaults */
    }
  }
  const round = (x: number) => Number(x.toPrecision(3));
  return {
    kind: "transfer-function",
    gainCPerPercent: round(fit.gainCPerPercent),
    timeConstantsS: [round(fit.timeConstantS)],
    deadTimeS: round(fit.deadTimeS),
    operatingPoint: op,
    ambientC,
    heaterRatingW: from?.heaterRatingW ?? 1000,
    nominalVoltageV: from?.nominalVoltageV ?? 230,
    sensorTimeConstantS: 0,
  };
}

/** A user-facing message for one zod issue on a number field. */
function messageOf(issue: z.core.$ZodIssue): string {
  switch (issue.code) {
    case "too_small":
      if (issue.origin === "array") return "Give at least one time constant.";
      return issue.inclusive ? `Must be at least ${formatNumber(Number(issue.minimum))}.` : `Must be more than ${formatNumber(Number(issue.minimum))}.`;
    case "too_big":
      if (issue.origin === "array") return "At most two time constants.";
      return issue.inclusive ? `Must be at most ${formatNumber(Number(issue.maximum))}.` : `Must be less than ${formatNumber(Number(issue.maximum))}.`;
    case "invalid_type":
      return "Enter a number.";
    default:
      return issue.message;
  }
}

interface Validation {
  definition: PlantDefinition | null;
  errors: Record<string, string>;
}

function validate(kind: Kind, lossModel: "linear" | "nonlinear", values: Values): Validation {
  const groups = kind === "enclosure" ? ENCLOSURE_GROUPS : TRANSFER_FUNCTION_GROUPS;
  const fields = [...groups.flatMap((g) => g.fields), ...(kind === "enclosure" && lossModel === "nonlinear" ? NONLINEAR_FIELDS : [])];
  const errors: Record<string, string> = {};
  const candidate: Record<string, unknown> = { kind };
  if (kind === "enclosure") candidate.lossModel = lossModel;
  for (const f of fields) {
    const text = (values[f.path] ?? "").trim().replace(/\u2212/g, "-");
    if (text === "" && f.optional) continue;
    const n = text === "" ? NaN : Number(text);
    if (!Number.isFinite(n)) errors[f.path] = "Enter a number.";
    set(candidate, f.path, n);
  }
  const schema = kind === "enclosure" ? enclosureParamsSchema : transferFunctionParamsSchema;
  const r = schema.safeParse(candidate);
  if (!r.success) {
    for (const issue of r.error.issues) {
      const key = issue.path.map(String).join(".");
      const field = fields.find((f) => f.path === key) ?? fields.find((f) => f.path.startsWith(`${key}.`));
      errors[field?.path ?? "form"] ??= messageOf(issue);
    }
  }
  return { definition: Object.keys(errors).length === 0 && r.success ? (r.data as PlantDefinition) : null, errors };
}

interface Figures {
  derived: DerivedFigures;
  fullOutputC: number;
}

function figuresOf(def: PlantDefinition | null, outPercent: number): Figures | null {
  if (!def || !Number.isFinite(outPercent) || outPercent < 0 || outPercent > 100) return null;
  try {
    const derived = derivedFigures(def, outPercent);
    const fullOutputC = steadyStateTemperatureC(def, 100);
    return [derived.staticGainCPerPercent, derived.steadyStateC, derived.dominantTimeConstantS, fullOutputC].every(Number.isFinite)
      ? { derived, fullOutputC }
      : null;
  } catch {
    return null;
  }
}

export interface PlantEditorProps {
  /** an existing plant of the user's: saving updates it */
  plant?: { id: string; name: string; description: string; definition: PlantDefinition; origin?: "physical" | "twin" | "preset" };
  /** where a new plant starts (for example a preset's definition); default: the first preset */
  startFrom?: PlantDefinition;
  /** called after a successful save with the plant's reference, its definition and name */
  onSaved?(ref: string, definition: PlantDefinition, title: string): void;
}

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

export function PlantEditor({ plant, startFrom, onSaved }: PlantEditorProps) {
  const start = plant?.definition ?? startFrom ?? PLANT_PRESETS[0].plant;
  const formId = useId();
  const [kind, setKind] = useState<Kind>(start.kind);
  const [lossModel, setLossModel] = useState<"linear" | "nonlinear">(start.kind === "enclosure" ? start.lossModel : "linear");
  const [enclosureValues, setEnclosureValues] = useState<Values>(() =>
    valuesFrom(start.kind === "enclosure" ? start : PLANT_PRESETS[0].plant, ENCLOSURE_GROUPS, NONLINEAR_FIELDS),
  );
  const [tfValues, setTfValues] = useState<Values>(() =>
    valuesFrom(start.kind === "transfer-function" ? start : defaultTransferFunction(start), TRANSFER_FUNCTION_GROUPS),
  );
  const [name, setName] = useState(plant?.name ?? "");
  const [description, setDescription] = useState(plant?.description ?? "");
  const [twin, setTwin] = useState(plant?.origin === "twin");
  const [outText, setOutText] = useState("50");

  const values = kind === "enclosure" ? enclosureValues : tfValues;
  const setValues = kind === "enclosure" ? setEnclosureValues : setTfValues;
  const validation = useMemo(() => validate(kind, lossModel, values), [kind, lossModel, values]);
  const outPercent = Number(outText);
  const outError = Number.isFinite(outPercent) && outText.trim() !== "" && outPercent >= 0 && outPercent <= 100 ? null : "OUT must lie between 0 and 100 %.";
  // The figures step the plant 16 000 times: deferred so typing stays responsive.
  const deferredDefinition = useDeferredValue(validation.definition);
  const figures = useMemo(() => figuresOf(deferredDefinition, outPercent), [deferredDefinition, outPercent]);

  // After the first save the editor goes on editing that plant (a second click updates it, it does not copy it).
  const [savedId, setSavedId] = useState<string | null>(null);
  const targetId = plant?.id ?? savedId;
  const [state, formAction, pending] = useActionState<ActionResult, FormData>(
    (previous, form) => ((form.has("update") ? updatePlant : savePlant) as Action)(previous, form),
    { ok: true },
  );
  useEffect(() => {
    const saved = state as SavedResult;
    if (saved.ok && saved.ref && saved.id && validation.definition) {
      setSavedId(saved.id);
      void mutate("/api/plants");
      onSaved?.(saved.ref, validation.definition, name.trim());
    }
    // only when a save has answered
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state]);

  const nameError = name.trim() === "" ? "Give the plant a name." : null;
  const canSave = validation.definition !== null && nameError === null && !pending;

  const submit = (form: FormData) => {
    if (!validation.definition) return;
    const origin = kind === "transfer-function" && twin ? "twin" : "physical";
    if (targetId) form.set("update", "1");
    form.set(
      "payload",
      JSON.stringify({ ...(targetId ? { plantId: targetId } : {}), name: name.trim(), description: description.trim(), definition: validation.definition, origin }),
    );
    return formAction(form);
  };

  const groups = kind === "enclosure" ? ENCLOSURE_GROUPS : TRANSFER_FUNCTION_GROUPS;

  return (
    <form action={submit} aria-label={targetId ? `Edit plant ${name}` : "New plant"} className="grid gap-6 text-sm lg:grid-cols-[minmax(0,1fr)_18rem]">
      <div className="space-y-5">
        <div className="flex flex-wrap items-end gap-4">
          <label className="block min-w-56 flex-1">
            <span className="mb-1 block font-medium text-ink-soft">Plant name</span>
            <input
              value={name}
              onChange={(e) => setName(e.target.value)}
              aria-invalid={nameError !== null}
              className="w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1.5"
              placeholder="e.g. Cabinet K-7, bay 2"
            />
          </label>
          <fieldset className="flex gap-3" aria-label="Model type">
            {(
              [
                ["enclosure", "Described physically"],
                ["transfer-function", "Transfer function"],
              ] as const
            ).map(([k, label]) => (
              <label key={k} className="flex items-center gap-1.5">
                <input type="radio" name={`${formId}-kind`} checked={kind === k} onChange={() => setKind(k)} />
                {label}
              </label>
            ))}
          </fieldset>
        </div>
        <label className="block">
          <span className="mb-1 block font-medium text-ink-soft">Description</span>
          <input
            value={description}
            onChange={(e) => setDescription(e.target.value)}
            className="w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1.5"
            placeholder="where it stands, what it holds"
          />
        </label>

        {groups.map((g) => (
          <FieldGroup key={g.title} group={g} values={values} errors={validation.errors} onChange={(path, v) => setValues((old) => ({ ...old, [path]: v }))} />
        ))}

        {kind === "enclosure" ? (
          <fieldset className="space-y-2 border-t border-rule pt-3">
            <legend className="text-xs uppercase tracking-wide text-ink-faint">Losses</legend>
            <label className="flex items-center gap-2">
              <span className="text-ink-soft">Loss model</span>
              <select value={lossModel} onChange={(e) => setLossModel(e.target.value as "linear" | "nonlinear")} className="rounded-sm border border-rule-strong bg-paper-raised px-2 py-1">
                <option value="linear">linear (constant films)</option>
                <option value="nonlinear">natural convection and radiation</option>
              </select>
            </label>
            {lossModel === "nonlinear" ? (
              <FieldGrid fields={NONLINEAR_FIELDS} values={values} errors={validation.errors} onChange={(path, v) => setValues((old) => ({ ...old, [path]: v }))} />
            ) : null}
          </fieldset>
        ) : (
          <label className="flex items-center gap-2 text-ink-soft">
            <input type="checkbox" checked={twin} onChange={(e) => setTwin(e.target.checked)} />
            Identified from a bump test on the real equipment (a twin)
          </label>
        )}
        {validation.errors.form ? (
          <p role="alert" className="text-alarm">
            {validation.errors.form}
          </p>
        ) : null}
      </div>

      <aside aria-label="Derived figures" className="space-y-3 self-start rounded-sm border border-rule bg-paper-raised p-3 lg:sticky lg:top-4">
        <h3 className="text-xs uppercase tracking-wide text-ink-faint">Derived figures</h3>
        <label className="flex items-center gap-2">
          <span className="text-ink-soft">at OUT</span>
          <input
            value={outText}
            onChange={(e) => setOutText(e.target.value)}
            inputMode="decimal"
            aria-label="OUT for the steady state"
            aria-invalid={outError !== null}
            className="num w-16 rounded-sm border border-rule-strong bg-paper px-1.5 py-0.5 text-right"
          />
          <span className="num text-ink-faint">%</span>
        </label>
        {outError ? <p className="text-xs text-alarm">{outError}</p> : null}
        {figures ? (
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1.5" data-testid="derived-figures">
            <dt className="text-ink-soft">Static gain</dt>
            <dd className="text-right">
              <Qty value={figures.derived.staticGainCPerPercent} unit="°C/%" testId="figure-gain" />
            </dd>
            <dt className="text-ink-soft">Steady state</dt>
            <dd className="text-right">
              <Qty value={figures.derived.steadyStateC} unit="°C" testId="figure-steady-state" />
            </dd>
            <dt className="text-ink-soft">at OUT 100 %</dt>
            <dd className="text-right">
              <Qty value={figures.fullOutputC} unit="°C" testId="figure-full-output" />
            </dd>
            <dt className="text-ink-soft">Dominant time constant</dt>
            <dd className="text-right">
              <Duration seconds={figures.derived.dominantTimeConstantS} testId="figure-time-constant" />
            </dd>
            <dt className="text-ink-soft">Apparent dead time</dt>
            <dd className="text-right">
              <Duration seconds={figures.derived.apparentDeadTimeS} testId="figure-dead-time" />
            </dd>
            <dt className="text-ink-soft">Time to 63 %</dt>
            <dd className="text-right">
              <Duration seconds={figures.derived.timeTo63PercentS} testId="figure-t63" />
            </dd>
            <dt className="col-span-2 mt-2 text-xs uppercase tracking-wide text-ink-faint">Two-point FOPDT fit</dt>
            <dt className="text-ink-soft">K</dt>
            <dd className="text-right">
              <Qty value={figures.derived.fopdtFit.gainCPerPercent} unit="°C/%" />
            </dd>
            <dt className="text-ink-soft">τ</dt>
            <dd className="text-right">
              <Qty value={figures.derived.fopdtFit.timeConstantS} unit="s" />
            </dd>
            <dt className="text-ink-soft">θ</dt>
            <dd className="text-right">
              <Qty value={figures.derived.fopdtFit.deadTimeS} unit="s" />
            </dd>
          </dl>
        ) : (
          <p className="text-ink-faint" data-testid="figures-unavailable">
            The figures appear when every field is valid.
          </p>
        )}
        <p className="text-xs text-ink-faint">Open-loop step 0 → 100 % from ambient, seen by the sensor element; dead time by the inflection tangent.</p>
      </aside>

      <div className="space-y-3 lg:col-span-2">
        <FormOutcome state={state} />
        <div className="flex items-center gap-3">
          <button type="submit" disabled={!canSave} className="rounded-sm bg-ink px-4 py-2 font-medium text-paper hover:bg-ink-soft disabled:opacity-50">
            {pending ? "Saving…" : targetId ? "Save changes" : "Save plant"}
          </button>
          {!validation.definition ? (
            <span className="text-xs text-ink-faint">Correct the marked fields to save.</span>
          ) : nameError ? (
            <span className="text-xs text-ink-faint">{nameError}</span>
          ) : null}
        </div>
      </div>
    </form>
  );
}

function FieldGroup({ group, values, errors, onChange }: { group: Group; values: Values; errors: Record<string, string>; onChange(path: string, value: string): void }) {
  return (
    <fieldset className="border-t border-rule pt-3">
      <legend className="text-xs uppercase tracking-wide text-ink-faint">{group.title}</legend>
      <FieldGrid fields={group.fields} values={values} errors={errors} onChange={onChange} />
    </fieldset>
  );
}

function FieldGrid({ fields, values, errors, onChange }: { fields: FieldSpec[]; values: Values; errors: Record<string, string>; onChange(path: string, value: string): void }) {
  const base = useId();
  return (
    <div className="mt-2 grid gap-x-5 gap-y-3 sm:grid-cols-2">
      {fields.map((f) => {
        const id = `${base}-${f.path}`;
        const error = errors[f.path];
        return (
          <div key={f.path}>
            <label htmlFor={id} className="mb-0.5 block text-ink-soft">
              {f.label}
            </label>
            <span className="flex items-center gap-1.5">
              <input
                id={id}
                value={values[f.path] ?? ""}
                onChange={(e) => onChange(f.path, e.target.value)}
                inputMode="decimal"
                autoComplete="off"
                aria-invalid={error ? true : undefined}
                aria-describedby={error ? `${id}-error` : undefined}
                className={`num w-full rounded-sm border bg-paper-raised px-2 py-1 text-right ${error ? "border-alarm" : "border-rule-strong"}`}
              />
              <span className="num w-24 shrink-0 text-xs text-ink-faint">{f.unit}</span>
            </span>
            {error ? (
              <span id={`${id}-error`} role="alert" className="mt-0.5 block text-xs text-alarm">
                {error}
              </span>
            ) : f.hint ? (
              <span className="mt-0.5 block text-xs text-ink-faint">{f.hint}</span>
            ) : null}
          </div>
        );
      })}
    </div>
  );
}
