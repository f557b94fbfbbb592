"use client";
/**
 * From what a relay or bump test measured to a tuning the technician can apply: the rule, PI or
 * PID and the block's form are chosen here (the toolkit's `propose` recomputes at once), the
 * figures are shown in the user's units, with the recommended sample time and PV filter and the
 * robustness of the chosen tuning on the model. Applying needs an explicit confirmation and goes
 * through `onApply` (the Bench applies it bumplessly).
 */
import { useMemo, useState } from "react";
import type { ControllerConfig } from "@/sim/control/config";
import type { ProcessModel } from "@/sim/tuning/models";
import { propose } from "@/sim/tuning/proposal";
import type { BlockForm } from "@/sim/tuning/rules/form-conversion";
import type { ControllerType } from "@/sim/tuning/rules/tuning";
import type { UltimatePoint } from "@/sim/tuning/rules/validate";
import type { SampleTimeAndFilter } from "@/sim/tuning/rules/sample-time-and-filter";
import type { LoopLags } from "@/sim/tuning/robustness/loop";
import { toFormValues, unitLabel } from "../controller-units";
import type { DisplayUnits } from "../store";
import { Qty } from "../plants/format";
import { temperatureDeltaToDisplay } from "@/sim/units";
import { FORM_LABELS, RULE_LABELS, ruleChoices } from "./labels";

export interface ProposalViewProps {
  ultimate?: UltimatePoint;
  model?: ProcessModel;
  /** the controller configuration the test ran with (sample time, filter, limits are kept) */
  base: ControllerConfig;
  initial: { rule?: string; controller?: ControllerType; form?: BlockForm };
  sampleTimeAndFilter: SampleTimeAndFilter | null;
  extraLags?: LoopLags;
  units: DisplayUnits;
  spanC: number;
  onApply: (cfg: ControllerConfig, origin?: ProposalOrigin) => void;
  /** id prefix for the form controls */
  idPrefix: string;
}

/** Where an applied tuning came from: the rule actually used (the recommended one resolved) and the model, if any. */
export interface ProposalOrigin {
  rule: string;
  controllerType: ControllerType;
  model: ProcessModel | null;
}

function fmtFactor(x: number): string {
  return Number.isFinite(x) ? String(+x.toPrecision(3)) : "∞";
}

export function ProposalView({ ultimate, model, base, initial, sampleTimeAndFilter, extraLags, units, spanC, onApply, idPrefix }: ProposalViewProps) {
  const [rule, setRule] = useState(initial.rule ?? "");
  const [controller, setController] = useState<ControllerType>(initial.controller ?? "PID");
  const [form, setForm] = useState<BlockForm>(initial.form ?? base.form);
  const [withFilter, setWithFilter] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [applied, setApplied] = useState<string | null>(null);

  const proposal = useMemo(() => propose({ ultimate, model, rule: rule || undefined, controller, form, base, extraLags }), [ultimate, model, rule, controller, form, base, extraLags]);
  const rec = proposal.recommended;
  const choices = ruleChoices({ ultimate: !!ultimate, model: !!model });
  const filterTau = sampleTimeAndFilter?.pvFilterTauS ?? 0;
  const offerFilter = !!sampleTimeAndFilter && Math.abs(filterTau - base.pvFilterTauS) > 1e-9;
  const cfg: ControllerConfig | null = "refused" in rec || !rec.controllerConfig ? null : withFilter && offerFilter ? { ...rec.controllerConfig, pvFilterTauS: filterTau } : rec.controllerConfig;
  const shown = cfg ? toFormValues(cfg, units, spanC) : null;
  const reset = () => {
    setConfirming(false);
    setApplied(null);
  };

  const select = "rounded-sm border border-rule-strong bg-paper px-1 py-0.5 text-xs";
  return (
    <div className="space-y-2" data-testid={`${idPrefix}-proposal`}>
      <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Proposed tuning</h3>
      <div className="grid grid-cols-[auto_1fr] items-center gap-x-2 gap-y-1 text-xs">
        <label htmlFor={`${idPrefix}-p-rule`} className="text-ink-soft">
          Rule
        </label>
        <select id={`${idPrefix}-p-rule`} value={rule} onChange={(e) => (setRule(e.target.value), reset())} className={select}>
          <option value="">recommended</option>
          {choices.map((r) => (
            <option key={r} value={r}>
              {RULE_LABELS[r] ?? r}
            </option>
          ))}
        </select>
        <label htmlFor={`${idPrefix}-p-controller`} className="text-ink-soft">
          Controller
        </label>
        <select id={`${idPrefix}-p-controller`} value={controller} onChange={(e) => (setController(e.target.value as ControllerType), reset())} className={select}>
          <option value="PI">PI</option>
          <option value="PID">PID</option>
        </select>
        <label htmlFor={`${idPrefix}-p-form`} className="text-ink-soft">
          Form
        </label>
        <select id={`${idPrefix}-p-form`} value={form} onChange={(e) => (setForm(e.target.value as BlockForm), reset())} className={select}>
          {(Object.keys(FORM_LABELS) as BlockForm[]).map((f) => (
            <option key={f} value={f}>
              {FORM_LABELS[f]}
            </option>
          ))}
        </select>
      </div>

      {"refused" in rec ? (
        <p className="rounded-sm border border-caution/50 bg-caution-soft px-2 py-1.5 text-xs text-caution" data-testid={`${idPrefix}-refused`}>
          No tuning: {rec.reason}
        </p>
      ) : (
        <>
          <p className="text-xs text-ink-soft">
            {RULE_LABELS[rec.tuning.rule] ?? rec.tuning.rule}, {rec.tuning.controller}
            <span className="text-ink-faint"> · {rec.tuning.source}</span>
          </p>
          {!rec.conversion.ok ? (
            <p className="rounded-sm border border-caution/50 bg-caution-soft px-2 py-1.5 text-xs text-caution" data-testid={`${idPrefix}-not-representable`}>
              Not representable in the {FORM_LABELS[rec.conversion.form]} form: {rec.conversion.reason.replace(/^not representable in the series form: /, "")}
            </p>
          ) : shown && cfg ? (
            <dl className="grid grid-cols-[1fr_auto] gap-y-0.5 text-xs" data-testid={`${idPrefix}-tuning`}>
              <dt className="text-ink-soft">{units.gain === "pb" ? "Proportional band" : cfg.form === "parallel" ? "Gain Kp" : "Gain Kc"}</dt>
              <dd className="num" data-testid={`${idPrefix}-kc`}>
                {shown.kc} {unitLabel("kc", units)}
              </dd>
              {cfg.form === "parallel" ? (
                <>
                  <dt className="text-ink-soft">Integral gain Ki</dt>
                  <dd className="num">
                    {shown.ki} {unitLabel("ki", units)}
                  </dd>
                  <dt className="text-ink-soft">Derivative gain Kd</dt>
                  <dd className="num">
                    {shown.kd} {unitLabel("kd", units)}
                  </dd>
                </>
              ) : (
                <>
                  <dt className="text-ink-soft">Integral Ti</dt>
                  <dd className="num">{cfg.ti === 0 ? "off" : `${shown.ti} ${unitLabel("ti", units)}`}</dd>
                  <dt className="text-ink-soft">Derivative Td</dt>
                  <dd className="num">{cfg.td === 0 ? "off" : `${shown.td} ${unitLabel("td", units)}`}</dd>
                </>
              )}
              {rec.conversion.tuning.pvFilterTauS ? (
                <>
                  <dt className="text-ink-soft">PV filter τf (from the rule)</dt>
                  <dd>
                    <Qty value={rec.conversion.tuning.pvFilterTauS} unit="s" />
                  </dd>
                </>
              ) : null}
            </dl>
          ) : null}

          {rec.margins ? (
            <div className="space-y-1 text-xs" data-testid={`${idPrefix}-robustness`}>
              <dl className="grid grid-cols-3 gap-x-2">
                <div>
                  <dt className="text-ink-faint">Gain margin</dt>
                  <dd className="num">{fmtFactor(rec.margins.gainMargin)}</dd>
                </div>
                <div>
                  <dt className="text-ink-faint">Phase margin</dt>
                  <dd className="num">{Number.isFinite(rec.margins.phaseMarginDeg) ? `${rec.margins.phaseMarginDeg.toFixed(0)}°` : "∞"}</dd>
                </div>
                <div>
                  <dt className="text-ink-faint">Ms</dt>
                  <dd className={`num ${rec.assessment?.msAbove2 ? "text-caution" : ""}`}>{fmtFactor(rec.margins.maxSensitivity)}</dd>
                </div>
              </dl>
              {rec.assessment?.messages.map((m) => (
                <p key={m} className={rec.assessment?.msAbove2 || rec.assessment?.verdict === "unstable" ? "text-caution" : "text-ink-soft"}>
                  {m}
                </p>
              ))}
              <p className="text-ink-faint">margins of the standard-form equivalent on the {model?.kind === "sopdt" ? "SOPDT" : "FOPDT"} model</p>
            </div>
          ) : (
            <p className="text-xs text-ink-faint">No margins: they need a process model.</p>
          )}
        </>
      )}

      {sampleTimeAndFilter ? (
        <div className="text-xs" data-testid={`${idPrefix}-sample-filter`}>
          <dl className="grid grid-cols-[1fr_auto] gap-y-0.5">
            <dt className="text-ink-soft">Recommended sample time</dt>
            <dd>
              <Qty value={sampleTimeAndFilter.sampleTimeS} unit="s" />
              {sampleTimeAndFilter.sampleTimeS !== base.sampleTimeS ? <span className="text-ink-faint"> (now {base.sampleTimeS} s)</span> : null}
            </dd>
            <dt className="text-ink-soft">Recommended PV filter τf</dt>
            <dd>
              <Qty value={sampleTimeAndFilter.pvFilterTauS} unit="s" />
              <span className="text-ink-faint"> (now {base.pvFilterTauS} s)</span>
            </dd>
            <dt className="text-ink-soft">Noise left after it</dt>
            <dd>
              <Qty value={temperatureDeltaToDisplay(sampleTimeAndFilter.filteredSigmaC, units.temperature)} unit={`°${units.temperature} σ`} />
            </dd>
          </dl>
          <ul className="mt-0.5 list-disc pl-4 text-ink-faint">
            {sampleTimeAndFilter.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
          {offerFilter && cfg ? (
            <label className="mt-1 flex items-center gap-1.5 text-ink-soft">
              <input type="checkbox" checked={withFilter} onChange={(e) => (setWithFilter(e.target.checked), reset())} />
              apply the recommended PV filter with it
            </label>
          ) : null}
        </div>
      ) : null}

      {cfg ? (
        confirming ? (
          <div className="space-y-1.5 rounded-sm border border-rule-strong bg-paper px-2 py-2 text-xs" role="group" aria-label="Confirm the new tuning">
            <p>
              Load {cfg.form === "parallel" ? "Kp" : "Kc"} <span className="num">{shown?.kc} {unitLabel("kc", units)}</span>
              {cfg.form !== "parallel" ? (
                <>
                  , Ti <span className="num">{cfg.ti === 0 ? "off" : `${shown?.ti} ${unitLabel("ti", units)}`}</span>, Td <span className="num">{cfg.td === 0 ? "off" : `${shown?.td} ${unitLabel("td", units)}`}</span>
                </>
              ) : null}
              {withFilter && offerFilter ? (
                <>
                  , PV filter <span className="num">{filterTau} s</span>
                </>
              ) : null}{" "}
              into the controller now? It takes over bumplessly from the present OUT.
            </p>
            <div className="flex gap-2">
              <button
                type="button"
                className="rounded-sm bg-ink px-2.5 py-1 font-semibold text-paper hover:bg-ink-soft"
                onClick={() => {
                  onApply(cfg, "refused" in rec ? undefined : { rule: rec.tuning.rule, controllerType: rec.tuning.controller, model: model ?? null });
                  setConfirming(false);
                  setApplied(`Loaded into the controller (${RULE_LABELS[("refused" in rec ? "" : rec.tuning.rule)] ?? ""}, ${FORM_LABELS[cfg.form]} form).`);
                }}
              >
                Yes, load it
              </button>
              <button type="button" className="rounded-sm border border-rule-strong px-2.5 py-1 hover:border-ink" onClick={() => setConfirming(false)}>
                Keep the present tuning
              </button>
            </div>
          </div>
        ) : (
          <button type="button" className="w-full rounded-sm border border-ink px-3 py-1.5 text-sm font-semibold hover:bg-paper-sunk" onClick={() => (setConfirming(true), setApplied(null))}>
            Apply…
          </button>
        )
      ) : null}
      {applied ? (
        <p role="status" className="text-xs text-ok">
          {applied}
        </p>
      ) : null}
    </div>
  );
}
