// The record's figures as labelled text, one source for the page and the PDF so both show the
// same strings. Text is kept to what the PDF's standard Helvetica can print (WinAnsi): "tau",
// "theta", "-" rather than Greek letters or the minus sign; ° and ² are available.
import { RULE_LABELS } from "@/components/bench/tests/labels";
import type { DriveConfig } from "@/sim/actuator/drive-config";
import type { ControllerConfig } from "@/sim/control/config";
import type { ProofTestStored, RecordDocument, RecordModel } from "./record-document";

export interface Figure {
  key: string;
  label: string;
  value: string;
}

/** A number to `digits` significant figures, no exponent for everyday magnitudes, ASCII minus. */
export function num(x: number | null | undefined, digits = 3): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "-";
  if (x === 0) return "0";
  const r = Number(x.toPrecision(digits));
  const abs = Math.abs(r);
  const s = abs >= 1e-4 && abs < 1e9 ? String(r) : r.toExponential(digits - 1);
  return s.replace("e+", "e");
}

/** Tuning values as entered into a controller: six significant figures, so nothing is rounded away in practice. */
const setting = (x: number) => num(x, 6);

const withUnit = (x: number | null | undefined, unit: string, digits = 3) => (x === null || x === undefined || !Number.isFinite(x) ? "-" : `${num(x, digits)} ${unit}`);

const FORM_NAMES: Record<ControllerConfig["form"], string> = {
  standard: "standard (ISA ideal)",
  parallel: "parallel (independent gains)",
  series: "series (interacting)",
};

/** One line for lists: "PID · Kc 2.35 %/°C · Ti 240 s · Td 30 s". */
export function tuningSummary(c: ControllerConfig): string {
  if (c.kind === "onoff") return `On/off · hysteresis ${setting(c.hysteresisC)} °C`;
  if (c.form === "parallel") return `PID parallel · Kp ${setting(c.kc)} %/°C · Ki ${setting(c.ki)} %/(°C·s) · Kd ${setting(c.kd)} %·s/°C`;
  const kind = c.td > 0 ? (c.ti > 0 ? "PID" : "PD") : c.ti > 0 ? "PI" : "P";
  const parts = [`${kind}`, `Kc ${setting(c.kc)} %/°C`];
  if (c.ti > 0) parts.push(`Ti ${setting(c.ti)} s`);
  if (c.td > 0) parts.push(`Td ${setting(c.td)} s`);
  return parts.join(" · ");
}

export function driveText(drive: DriveConfig | null | undefined): string {
  if (!drive) return "not stated (no proof test)";
  if (drive.kind === "continuous") return "continuous drive (0-100 %)";
  const min = drive.minOnTimeS > 0 || drive.minOffTimeS > 0 ? `, minimum on ${setting(drive.minOnTimeS)} s, off ${setting(drive.minOffTimeS)} s` : "";
  return `time-proportioning, cycle time ${setting(drive.cycleTimeS)} s${min}`;
}

function antiWindupText(c: ControllerConfig): string {
  if (c.antiWindup === "none") return "none (the integral winds up)";
  if (c.antiWindup === "conditional") return "conditional integration";
  return `back-calculation, tracking time ${c.trackingTimeS > 0 ? `${setting(c.trackingTimeS)} s` : "default"}`;
}

/** The tuning in its form and units (sim/control/config.ts), with the final element. */
export function tuningFigures(c: ControllerConfig, drive: DriveConfig | null | undefined): Figure[] {
  const f: Figure[] = [];
  const add = (key: string, label: string, value: string) => f.push({ key, label, value });
  if (c.kind === "onoff") {
    add("kind", "Control", "on/off");
    add("hysteresis", "Hysteresis", `${setting(c.hysteresisC)} °C`);
    add("outOn", "OUT on / off", `${setting(c.outOnPct)} % / ${setting(c.outOffPct)} %`);
  } else {
    add("kind", "Control", `PID, ${FORM_NAMES[c.form]} form`);
    if (c.form === "parallel") {
      add("kc", "Kp", `${setting(c.kc)} %/°C`);
      add("ki", "Ki", `${setting(c.ki)} %/(°C·s)`);
      add("kd", "Kd", `${setting(c.kd)} %·s/°C`);
    } else {
      add("kc", "Kc", `${setting(c.kc)} %/°C`);
      add("ti", "Ti", c.ti > 0 ? `${setting(c.ti)} s` : "off (no integral action)");
      add("td", "Td", c.td > 0 ? `${setting(c.td)} s` : "off (no derivative action)");
    }
    const hasD = c.form === "parallel" ? c.kd > 0 : c.td > 0;
    if (hasD) {
      add("derivativeOn", "Derivative on", c.derivativeOn === "pv" ? "PV (no kick on SP changes)" : `error (weight c ${setting(c.setpointWeightC)})`);
      add("derivativeFilter", "Derivative filter", `Td/N, N ${setting(c.derivativeFilterN)}`);
    }
    if (c.setpointWeightB !== 1) add("setpointWeightB", "SP weight b", setting(c.setpointWeightB));
    add("antiWindup", "Anti-windup", antiWindupText(c));
    if (c.deadbandC > 0) add("deadband", "Deadband", `${setting(c.deadbandC)} °C`);
  }
  add("action", "Action", c.action === "reverse" ? "reverse (heating: OUT rises when PV < SP)" : "direct (OUT rises when PV > SP)");
  add("pvFilter", "PV filter", c.pvFilterTauS > 0 ? `tau ${setting(c.pvFilterTauS)} s` : "off");
  add("sampleTime", "Sample time", `${setting(c.sampleTimeS)} s`);
  add("drive", "Final element", driveText(drive));
  add("limits", "OUT limits", `${setting(c.outMinPct)} % to ${setting(c.outMaxPct)} %`);
  if (c.outRateLimitPctPerS > 0) add("rateLimit", "OUT rate limit", `${setting(c.outRateLimitPctPerS)} %/s`);
  add("badPv", "On a bad PV", c.badPvPolicy === "hold" ? "hold the last OUT" : `go to ${setting(c.safeOutputPct)} %`);
  return f;
}

export function modelText(m: RecordModel | null): string {
  if (!m) return "none";
  if (m.kind === "fopdt") return `FOPDT: K ${num(m.gainCPerPercent, 4)} °C/%, tau ${num(m.timeConstantS, 4)} s, theta ${num(m.deadTimeS, 4)} s`;
  return `SOPDT: K ${num(m.gainCPerPercent, 4)} °C/%, tau1 ${num(m.timeConstant1S, 4)} s, tau2 ${num(m.timeConstant2S, 4)} s, theta ${num(m.deadTimeS, 4)} s`;
}

const MODEL_SOURCES: Record<RecordDocument["modelSource"], string> = {
  twin: "the twin's identification",
  reported: "a bump test reported by the pre-commissioning flow",
  none: "no model",
};

export function modelFigures(doc: RecordDocument): Figure[] {
  return [
    { key: "model", label: "Model", value: modelText(doc.model) },
    { key: "modelSource", label: "From", value: MODEL_SOURCES[doc.modelSource] },
  ];
}

const VERDICTS: Record<string, string> = { unstable: "unstable", fragile: "fragile", acceptable: "acceptable", robust: "robust" };

export function marginFigures(doc: RecordDocument): Figure[] {
  const m = doc.margins;
  if (!m) {
    const why = doc.controller.kind === "onoff" ? "on/off control has no linear margins" : "no model to work them out on";
    return [{ key: "margins", label: "Margins", value: `not computed: ${why}` }];
  }
  const gm = m.gainMargin === null ? "unlimited (phase never reaches -180°)" : `${num(m.gainMargin)} (${num(20 * Math.log10(m.gainMargin))} dB)`;
  const f: Figure[] = [
    { key: "gainMargin", label: "Gain margin", value: gm },
    { key: "phaseMargin", label: "Phase margin", value: m.phaseMarginDeg === null ? "unlimited (|L| stays below 1)" : `${num(m.phaseMarginDeg)}°` },
    { key: "ms", label: "Ms", value: num(m.ms) },
  ];
  if (m.delayMarginS !== undefined) f.push({ key: "delayMargin", label: "Delay margin", value: m.delayMarginS === null ? "unlimited" : `${num(m.delayMarginS)} s` });
  f.push({ key: "verdict", label: "Reading", value: VERDICTS[m.verdict] ?? m.verdict });
  if (m.lags) {
    const l = m.lags;
    f.push({
      key: "lags",
      label: "Includes",
      value: `PV filter ${setting(l.pvFilterTauS)} s, sensor lag ${setting(l.sensorLagS)} s, half a sample (${setting(l.sampleTimeS / 2)} s), half a heater cycle (${setting(l.cycleTimeS / 2)} s)`,
    });
  }
  return f;
}

export const ORIGIN_NAMES: Record<RecordDocument["plant"]["origin"], string> = { physical: "described physically", twin: "twin", preset: "built-in preset" };

export function plantFigures(doc: RecordDocument): Figure[] {
  const p = doc.plant;
  const f: Figure[] = [
    { key: "plantName", label: "Plant", value: p.name },
    { key: "origin", label: "Kind", value: ORIGIN_NAMES[p.origin] },
  ];
  if (p.sourceUpload) {
    f.push({ key: "sourceFile", label: "Source file", value: `${p.sourceUpload.fileName} (${p.sourceUpload.byteSize} bytes)` });
    f.push({ key: "sha256", label: "SHA-256", value: p.sourceUpload.sha256 });
  }
  return f;
}

export function relayFigures(doc: RecordDocument): Figure[] {
  const r = doc.relay;
  if (!r) return [];
  return [
    { key: "ku", label: "Ultimate gain Ku", value: `${num(r.ultimateGain, 4)} %/°C` },
    { key: "pu", label: "Ultimate period Pu", value: `${num(r.ultimatePeriodS, 4)} s` },
    { key: "amplitudes", label: "Amplitudes", value: `PV ${num(r.pvAmplitudeC)} °C, relay ${num(r.relayAmplitudePercent)} %` },
    { key: "rule", label: "Rule", value: RULE_LABELS[r.rule] ?? r.rule },
  ];
}

export function powerCurveRows(doc: RecordDocument): [string, string][] {
  return (doc.powerCurve?.points ?? []).map((p) => [`${num(p.outPercent)} %`, `${num(p.temperatureC, 4)} °C`]);
}

export const PROOF_COLUMNS = ["Window", "IAE", "Overshoot", "Settling", "Rise"] as const;

/** A test's results table: one row per window, then the whole run. */
export function proofRows(t: ProofTestStored): string[][] {
  const row = (label: string, w: { iae: number | null; overshootPct: number | null; settlingTimeS?: number | null; riseTimeS?: number | null }) => [
    label,
    withUnit(w.iae, "°C·s"),
    withUnit(w.overshootPct, "%"),
    withUnit(w.settlingTimeS ?? null, "s"),
    withUnit(w.riseTimeS ?? null, "s"),
  ];
  const rows = t.windows.map((w) => row(`${w.label} (${w.kind})`, w));
  rows.push(row("Whole run", t.wholeRun as { iae: number | null; overshootPct: number | null; settlingTimeS?: number | null; riseTimeS?: number | null }));
  return rows;
}

/** Which drill a test ran: a stored version, or the flow's own timeline with the drill's revision. */
export function drillVersionText(t: ProofTestStored): string {
  return t.drillVersion ? `${t.drillVersion.title}, version ${t.drillVersion.version}` : `${t.drill.title} (ad-hoc timeline, revision ${t.drill.revision})`;
}

export function proofFacts(t: ProofTestStored): Figure[] {
  const summary = tuningSummary(t.controller);
  return [
    { key: "drill", label: "Drill", value: drillVersionText(t) },
    { key: "tuning", label: "Tuning", value: summary.startsWith(`${t.tuningLabel} `) ? summary : `${t.tuningLabel}: ${summary}` },
    { key: "duration", label: "Duration", value: `${num(t.durationS / 60, 4)} min` },
    { key: "seed", label: "Seed", value: String(t.seed) },
    { key: "trips", label: "Cutout trips", value: String(t.safetyTrips) },
    { key: "energy", label: "Heater energy", value: withUnit(t.heaterEnergyKWh, "kWh") },
    { key: "fingerprint", label: "Trace fingerprint", value: t.traceFingerprint },
  ];
}

export const SAFETY_CAUTION =
  "Caution: these figures come from a model, not from the equipment. Before applying the tuning, make sure the heater has an independent, manually reset excess-temperature cutout. Mains wiring and heater work follow local codes and are done by licensed people; where this record and local codes or the equipment maker's instructions differ, those prevail.";
