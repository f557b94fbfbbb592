/**
 * Loopwright engine, headless. Wraps the pure engine (sim/) with file input/output.
 * Run `npm run sim -- --help` for the commands.
 */
import { readFileSync, writeFileSync } from "node:fs";
import { parseDrill, runDrill, traceToCsv, actionLogSchema, drillJsonSchemaText, type StampedAction } from "../drill";
import { controllerConfigSchema } from "../control/config";
import { PLANT_PRESETS } from "../plant/presets";
import { derivedFigures } from "../plant/derived-figures";
import { ENGINE_VERSION } from "../version";

const HELP = `Loopwright engine ${ENGINE_VERSION} — headless simulation of drills

Usage:
  npm run sim -- <command> [arguments] [options]

Commands:
  run <drill.json>        Run a drill and print its results as JSON on stdout:
                          engine version, seed, controller used, results per scoring window and
                          for the whole run (true temperature and filtered PV), safety trips,
                          heater energy, events, and the score against the reference tuning.
      --seed N            noise seed (integer 0…4294967295); default: the drill's noise.seed
      --controller FILE   controller configuration JSON (the attempt's tuning); default: the
                          drill's reference tuning. Fields left out take their defaults.
      --actions FILE      operator action log JSON: [{ "sample": k, "type": ..., ... }, ...]
                          types: setpoint {setpointC}, mode {mode}, manual-output {outPercent},
                          tuning {controller}, cutout-reset
      --out FILE          also write the trace as CSV (one row per controller sample)
      --no-score          skip the reference run and the score
      --integrator KIND   exact (default, linear plants) | odex | rk4 (for comparisons)
  validate <drill.json>   Check a drill against the format; prints "valid" or the bad fields.
  schema [--out FILE]     Print (or write) the drill format's JSON Schema.
  presets                 List the plant presets with their derived figures at 50 % output.
  replay <replay.json>    Re-run a replay file exported from the Bench (drill, controller, seed,
                          action log); prints the trace fingerprint, whether it matches the
                          file's, and the results. Exit 1 when the fingerprints differ.
  autotune <drill.json> --method relay|bump [--rule NAME] [--form standard|parallel|series]
                          Run a relay test (closed loop) or a bump test (open loop) on the drill's
                          plant from its starting point and print the identified model, the
                          proposed tunings and their robustness as JSON (autotune --help).
  identify <data.csv>     Fit FOPDT and SOPDT models to a logged bump test (columns time, OUT %,
                          PV); prints the fits with R² and NRMSE, or a refusal (identify --help).
  help, --help, -h        Show this text.

Exit status: 0 success; 1 usage error; 2 invalid or unreadable input file.
`;

class CliError extends Error {
  constructor(message: string, readonly code: number) {
    super(message);
  }
}

function readJson(file: string, what: string): unknown {
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    throw new CliError(`cannot read ${what} ${file}: ${(e as Error).message}`, 2);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new CliError(`${what} ${file} is not valid JSON: ${(e as Error).message}`, 2);
  }
}

interface Parsed {
  positional: string[];
  flags: Map<string, string | true>;
}

const VALUE_FLAGS = new Set(["--seed", "--controller", "--actions", "--out", "--integrator"]);
const BOOL_FLAGS = new Set(["--no-score", "--help", "-h"]);

function parseArgs(argv: string[]): Parsed {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (VALUE_FLAGS.has(a)) {
      const v = argv[++i];
      if (v === undefined) throw new CliError(`option ${a} needs a value`, 1);
      flags.set(a, v);
    } else if (BOOL_FLAGS.has(a)) flags.set(a, true);
    else if (a.startsWith("-")) throw new CliError(`unknown option ${a} (see --help)`, 1);
    else positional.push(a);
  }
  return { positional, flags };
}

function loadDrill(file: string | undefined) {
  if (!file) throw new CliError("missing drill file (see --help)", 1);
  const parsed = parseDrill(readJson(file, "drill"));
  if (!parsed.ok) throw new CliError(`invalid drill ${file}:\n` + parsed.errors.map((e) => `  ${e}`).join("\n"), 2);
  return parsed.drill;
}

function cmdRun(p: Parsed): void {
  const drill = loadDrill(p.positional[1]);
  const seedFlag = p.flags.get("--seed");
  let seed: number | undefined;
  if (typeof seedFlag === "string") {
    seed = Number(seedFlag);
    if (!Number.isInteger(seed) || seed < 0 || seed > 4294967295) throw new CliError(`--seed must be an integer 0…4294967295, got ${seedFlag}`, 1);
  }
  let controller;
  const cf = p.flags.get("--controller");
  if (typeof cf === "string") {
    const r = controllerConfigSchema.safeParse(readJson(cf, "controller"));
    if (!r.success) throw new CliError(`invalid controller ${cf}:\n` + r.error.issues.map((i) => `  ${i.path.join(".") || "(document)"}: ${i.message}`).join("\n"), 2);
    controller = r.data;
  }
  let actions: StampedAction[] = [];
  const af = p.flags.get("--actions");
  if (typeof af === "string") {
    const r = actionLogSchema.safeParse(readJson(af, "action log"));
    if (!r.success) throw new CliError(`invalid action log ${af}:\n` + r.error.issues.map((i) => `  ${i.path.join(".") || "(document)"}: ${i.message}`).join("\n"), 2);
    actions = r.data as StampedAction[];
  }
  const integ = p.flags.get("--integrator");
  if (integ !== undefined && integ !== "exact" && integ !== "odex" && integ !== "rk4") throw new CliError(`--integrator must be exact, odex or rk4`, 1);
  const run = runDrill(drill, controller, actions, seed, { score: !p.flags.has("--no-score"), integrator: integ as "exact" | "odex" | "rk4" | undefined });
  const out = p.flags.get("--out");
  if (typeof out === "string") writeFileSync(out, traceToCsv(run.trace));
  const report = {
    engineVersion: run.engineVersion,
    drillId: drill.id,
    seed: run.seed,
    controller: run.controller,
    samples: run.trace.length,
    results: run.results,
    score: run.score ?? null,
    events: run.events,
  };
  process.stdout.write(JSON.stringify(report, null, 2) + "\n");
}

function main(argv: string[]): number {
  const p = parseArgs(argv);
  const cmd = p.positional[0];
  if (p.flags.has("--help") || p.flags.has("-h") || cmd === "help" || cmd === undefined) {
    process.stdout.write(HELP);
    return cmd === undefined && !p.flags.has("--help") && !p.flags.has("-h") ? 1 : 0;
  }
  switch (cmd) {
    case "run":
      cmdRun(p);
      return 0;
    case "validate":
      loadDrill(p.positional[1]);
      process.stdout.write("valid\n");
      return 0;
    case "schema": {
      const out = p.flags.get("--out");
      if (typeof out === "string") writeFileSync(out, drillJsonSchemaText());
      else process.stdout.write(drillJsonSchemaText());
      return 0;
    }
    case "presets":
      process.stdout.write(
        JSON.stringify(PLANT_PRESETS.map((pr) => ({ id: pr.id, title: pr.title, description: pr.description, cutoutTripC: pr.cutoutTripC, figuresAt50Percent: derivedFigures(pr.plant, 50) })), null, 2) + "\n",
      );
      return 0;
    default:
      throw new CliError(`unknown command "${cmd}" (see --help)`, 1);
  }
}

// Commands with their own modules (and their own options) in sim/cli/commands/.
const MODULE_COMMANDS: Record<string, () => Promise<(argv: string[]) => Promise<number>>> = {
  replay: async () => (await import("./commands/replay")).runReplayCommand,
  autotune: async () => (await import("./commands/autotune")).runAutotuneCommand,
  identify: async () => (await import("./commands/identify")).runIdentifyCommand,
};

async function entry(argv: string[]): Promise<number> {
  const load = MODULE_COMMANDS[argv[0] ?? ""];
  return load ? (await load())(argv.slice(1)) : main(argv);
}

entry(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (e) => {
    if (e instanceof CliError) {
      process.stderr.write(`loopwright sim: ${e.message}\n`);
      process.exitCode = e.code;
    } else {
      process.stderr.write(`loopwright sim: ${(e as Error).stack ?? e}\n`);
      process.exitCode = 3;
    }
  },
);
