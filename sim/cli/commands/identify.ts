// `sim identify data.csv`: FOPDT/SOPDT identification of a logged bump test (time, OUT %, PV °C),
// printed as JSON with the fit quality, warnings and a proposed tuning.
// Exit status: 0 identified; 1 usage error; 2 unreadable file, unreadable columns or a record
// the identification refuses (no step, too few points, PV flat, time not increasing).
import { readFileSync } from "node:fs";
import { controllerConfigSchema } from "../../control/config";
import { identifyStepResponse, parseStepRecordCsv } from "../../tuning/identify";
import { propose } from "../../tuning/proposal";
import { recommendSampleTimeAndFilter } from "../../tuning/rules";
import { ALL_RULES } from "../../tuning/rules/catalog";
import type { BlockForm } from "../../tuning/rules/form-conversion";
import type { ControllerType } from "../../tuning/rules/tuning";
import { ENGINE_VERSION } from "../../version";

export const IDENTIFY_USAGE = `usage: sim identify <data.csv> [options]
  data.csv: a bump-test log with columns time (s), OUT (%), PV (°C); header names like
  time,out,pv (or no header: the first three columns in that order); irregular sampling is fine.
options:
  --rule NAME            tuning rule for the proposal (${ALL_RULES.join(", ")})
  --controller PI|PID    default PID
  --form standard|parallel|series   default standard
  --fopdt-only           skip the SOPDT fit
exit status: 0 identified; 1 usage error; 2 unreadable input or refused record`;

function fail(message: string, code: number): number {
  process.stderr.write(`loopwright sim identify: ${message}\n`);
  return code;
}

export function parseCommonTuningFlags(argv: string[], extraValue: string[] = [], extraBool: string[] = []) {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  const valueFlags = new Set(["--rule", "--controller", "--form", ...extraValue]);
  const boolFlags = new Set(["--help", "-h", ...extraBool]);
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (valueFlags.has(a)) {
      const v = argv[++i];
      if (v === undefined) return { error: `option ${a} needs a value` } as const;
      flags.set(a, v);
    } else if (boolFlags.has(a)) flags.set(a, true);
    else if (a.startsWith("-")) return { error: `unknown option ${a}` } as const;
    else positional.push(a);
  }
  const controller = flags.get("--controller");
  if (controller !== undefined && controller !== "PI" && controller !== "PID") return { error: "--controller must be PI or PID" } as const;
  const form = flags.get("--form");
  if (form !== undefined && form !== "standard" && form !== "parallel" && form !== "series") return { error: "--form must be standard, parallel or series" } as const;
  const rule = flags.get("--rule");
  if (typeof rule === "string" && !(ALL_RULES as readonly string[]).includes(rule)) return { error: `unknown rule "${rule}"; known rules: ${ALL_RULES.join(", ")}` } as const;
  return {
    positional,
    flags,
    rule: typeof rule === "string" ? rule : undefined,
    controller: controller as ControllerType | undefined,
    form: form as BlockForm | undefined,
  } as const;
}

export async function runIdentifyCommand(argv: string[]): Promise<number> {
  const p = parseCommonTuningFlags(argv, [], ["--fopdt-only"]);
  if ("error" in p) return fail(`${p.error}\n${IDENTIFY_USAGE}`, 1);
  if (p.flags.has("--help") || p.flags.has("-h")) {
    process.stdout.write(IDENTIFY_USAGE + "\n");
    return 0;
  }
  const file = p.positional[0];
  if (!file || p.positional.length > 1) return fail(`expected one data file\n${IDENTIFY_USAGE}`, 1);
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    return fail(`cannot read ${file}: ${(e as Error).message}`, 2);
  }
  const csv = parseStepRecordCsv(text);
  if (!csv.ok) return fail(`${file}: ${csv.message}`, 2);
  const id = identifyStepResponse(csv.record, { fopdtOnly: p.flags.has("--fopdt-only") });
  if (!id.ok) return fail(`${file}: ${id.message}`, 2);

  const model = id.preferred === "sopdt" && id.sopdt ? id.sopdt.model : id.fopdt.model;
  // the controller the proposal is written for: defaults, so the numbers stand on their own
  const base = controllerConfigSchema.parse({ form: p.form ?? "standard", sampleTimeS: Math.max(0.1, id.samples.medianIntervalS) });
  const proposal = propose({ model, rule: p.rule, controller: p.controller, form: p.form, base });
  const fit = <M>(f: { model: M; baselineC: number; quality: unknown }) => ({ model: f.model, baselineC: f.baselineC, quality: f.quality });
  const report = {
    engineVersion: ENGINE_VERSION,
    file,
    columns: csv.columns,
    samples: id.samples,
    step: id.step,
    twoPoint: id.twoPoint,
    fopdt: fit(id.fopdt),
    sopdt: id.sopdt ? fit(id.sopdt) : null,
    preferred: id.preferred,
    noiseSigmaC: id.noiseSigmaC,
    residualSigmaC: id.residualSigmaC,
    warnings: id.warnings,
    sampleTimeAndFilter: recommendSampleTimeAndFilter({ model, noiseSigmaC: id.noiseSigmaC }),
    proposal: { recommended: proposal.recommended, tunings: proposal.tunings },
  };
  process.stdout.write(JSON.stringify(report, null, 2) + "\n");
  return 0;
}
