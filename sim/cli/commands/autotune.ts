// `sim autotune drill.json --method relay|bump`: runs a relay test (closed loop) or a bump test
// (open loop) on the drill's plant with its reference tuning, from the drill's initial state, and
// prints the measured figures and the proposed tuning as JSON.
// Exit status: 0 a tuning was found; 1 usage error; 2 unreadable or invalid drill;
// 4 the test ran but gave no tuning (relay aborted, bump record refused, rule refused).
import { readFileSync } from "node:fs";
import { parseDrill, Simulation } from "../../drill";
import { BumpTest } from "../../tuning/bump";
import { RelayTest } from "../../tuning/relay";
import { ALL_RULES } from "../../tuning/rules/catalog";
import { ENGINE_VERSION } from "../../version";
import { parseCommonTuningFlags } from "./identify";

export const AUTOTUNE_USAGE = `usage: sim autotune <drill.json> --method relay|bump [options]
options:
  --method relay|bump    relay: closed-loop relay test around SP; bump: open-loop OUT step
  --rule NAME            tuning rule (${ALL_RULES.join(", ")});
                         default relay: tyreus-luyben; bump: simc/amigo/imc-lambda
  --controller PI|PID    default PID
  --form standard|parallel|series   default: the drill's reference tuning form
  --seed N               noise seed; default the drill's
  --amplitude PCT        relay amplitude or bump step, % (default 10)
  --hysteresis C         relay hysteresis ε, °C (switches at SP ± ε; default 3σ of the noise)
exit status: 0 tuning found; 1 usage error; 2 invalid drill; 4 test gave no tuning`;

function fail(message: string, code: number): number {
  process.stderr.write(`loopwright sim autotune: ${message}\n`);
  return code;
}

function numberFlag(v: string | true | undefined, name: string): number | undefined | { error: string } {
  if (v === undefined) return undefined;
  const x = Number(v);
  if (typeof v !== "string" || !Number.isFinite(x)) return { error: `${name} needs a number` };
  return x;
}

export async function runAutotuneCommand(argv: string[]): Promise<number> {
  const p = parseCommonTuningFlags(argv, ["--method", "--seed", "--amplitude", "--hysteresis"]);
  if ("error" in p) return fail(`${p.error}\n${AUTOTUNE_USAGE}`, 1);
  if (p.flags.has("--help") || p.flags.has("-h")) {
    process.stdout.write(AUTOTUNE_USAGE + "\n");
    return 0;
  }
  const method = p.flags.get("--method");
  if (method !== "relay" && method !== "bump") return fail(`--method relay|bump is required\n${AUTOTUNE_USAGE}`, 1);
  const file = p.positional[0];
  if (!file || p.positional.length > 1) return fail(`expected one drill file\n${AUTOTUNE_USAGE}`, 1);
  const seed = numberFlag(p.flags.get("--seed"), "--seed");
  const amplitude = numberFlag(p.flags.get("--amplitude"), "--amplitude");
  const hysteresis = numberFlag(p.flags.get("--hysteresis"), "--hysteresis");
  for (const v of [seed, amplitude, hysteresis]) if (typeof v === "object") return fail(v.error, 1);
  if (typeof seed === "number" && !(Number.isInteger(seed) && seed >= 0 && seed <= 4294967295)) return fail("--seed must be an integer 0…4294967295", 1);
  if (typeof hysteresis === "number" && hysteresis < 0) return fail("--hysteresis must be zero or positive", 1);

  let json: unknown;
  try {
    json = JSON.parse(readFileSync(file, "utf8"));
  } catch (e) {
    return fail(`cannot read drill ${file}: ${(e as Error).message}`, 2);
  }
  const parsed = parseDrill(json);
  if (!parsed.ok) return fail(`invalid drill ${file}:\n${parsed.errors.map((e) => `  ${e}`).join("\n")}`, 2);
  // the test runs on the drill's plant from its initial state, without its event timeline (a
  // scheduled setpoint step or disturbance would spoil the measurement)
  const drill = { ...parsed.drill, events: [] };
  let sim: Simulation;
  try {
    sim = new Simulation(drill, { seed: seed as number | undefined });
  } catch (e) {
    return fail(`cannot set up drill ${file}: ${(e as Error).message}`, 2);
  }
  const notes: string[] = parsed.drill.events.length ? [`the drill's ${parsed.drill.events.length} timeline event(s) are not applied during the test`] : [];
  if (method === "relay" && !drill.trainee.relayTestAllowed) notes.push("this drill does not allow trainees a relay test (run here for the instructor)");
  if (method === "bump" && !drill.trainee.bumpTestAllowed) notes.push("this drill does not allow trainees a bump test (run here for the instructor)");
  const common = { rule: p.rule, controller: p.controller, form: p.form };
  const head = { engineVersion: ENGINE_VERSION, drillId: drill.id, seed: sim.seed, method, notes };

  if (method === "relay") {
    const out = new RelayTest(sim, { ...common, amplitudePercent: amplitude as number | undefined, hysteresisC: hysteresis as number | undefined }).run();
    if (!out.ok) {
      process.stdout.write(JSON.stringify({ ...head, ok: false, code: out.code, message: out.message, start: out.start, progress: out.progress, warnings: out.warnings }, null, 2) + "\n");
      return fail(`relay test aborted: ${out.message}`, 4);
    }
    const rec = out.proposal.recommended;
    process.stdout.write(JSON.stringify({ ...head, ok: true, relay: { ...out, proposal: undefined }, recommended: rec, tunings: out.proposal.tunings }, null, 2) + "\n");
    if ("refused" in rec) return fail(`no tuning: ${rec.reason}`, 4);
    if (!rec.conversion.ok) return fail(rec.conversion.reason, 4);
    return 0;
  }
  const out = new BumpTest(sim, { ...common, stepPercent: amplitude as number | undefined }).run();
  if (!out.ok) {
    process.stdout.write(JSON.stringify({ ...head, ok: false, code: out.refusal.code, message: out.refusal.message }, null, 2) + "\n");
    return fail(`bump test gave no model: ${out.refusal.message}`, 4);
  }
  const id = out.identification;
  const fit = <M>(f: { model: M; baselineC: number; quality: unknown }) => ({ model: f.model, baselineC: f.baselineC, quality: f.quality });
  const rec = out.proposal.recommended;
  process.stdout.write(
    JSON.stringify(
      {
        ...head,
        ok: true,
        bump: { stepPercent: out.stepPercent, rows: out.record.t.length, step: id.step, twoPoint: id.twoPoint, fopdt: fit(id.fopdt), sopdt: id.sopdt ? fit(id.sopdt) : null, preferred: id.preferred, noiseSigmaC: id.noiseSigmaC, warnings: id.warnings, returned: out.returned },
        sampleTimeAndFilter: out.sampleTimeAndFilter,
        recommended: rec,
        tunings: out.proposal.tunings,
      },
      null,
      2,
    ) + "\n",
  );
  if ("refused" in rec) return fail(`no tuning: ${rec.reason}`, 4);
  if (!rec.conversion.ok) return fail(rec.conversion.reason, 4);
  return 0;
}
