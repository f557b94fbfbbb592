import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { runIdentifyCommand } from "@/sim/cli/commands/identify";
import { runAutotuneCommand } from "@/sim/cli/commands/autotune";
import { parseStepRecordCsv } from "@/sim/tuning/identify";
import { makeRecord } from "./bump-data";

let out = "";
let err = "";
beforeEach(() => {
  out = "";
  err = "";
  vi.spyOn(process.stdout, "write").mockImplementation((s: string | Uint8Array) => ((out += String(s)), true));
  vi.spyOn(process.stderr, "write").mockImplementation((s: string | Uint8Array) => ((err += String(s)), true));
});
afterEach(() => vi.restoreAllMocks());

const dir = mkdtempSync(join(tmpdir(), "loopwright-tuning-"));
function file(name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}
const rec = makeRecord({
  model: { gain: 0.8, taus: [120], deadTime: 15 }, seed: 3, durationS: 900, interval: [0.5, 1.5],
  out: (t) => (t < 60 ? 20 : 50), noiseSigma: 0.1, pv0: 45,
});
const csv = "# logged on rig 2\ntime_s,OUT %,PV (°C)\n" + rec.t.map((t, i) => `${t},${rec.out[i]},${rec.pv[i]}`).join("\n") + "\n";

describe("CSV reading", () => {
  it("finds columns by name (units ignored), or takes the first three without a header", () => {
    const a = parseStepRecordCsv("Temperature [°C];time;Output\n50;0;10\n51;1;10\n");
    expect(a.ok && a.record).toEqual({ t: [0, 1], out: [10, 10], pv: [50, 51] });
    const b = parseStepRecordCsv("0\t10\t50\n1\t10\t51\n");
    expect(b.ok && b.record.pv).toEqual([50, 51]);
    const c = parseStepRecordCsv("when,power,reading\n0,1,2\n");
    expect(c.ok).toBe(false);
    if (!c.ok) expect(c.message).toMatch(/cannot find the time, PV column/);
    const d = parseStepRecordCsv("t,out,pv\n0,10,50\n1,ten,50\n");
    if (!d.ok) expect(d.message).toMatch(/line 3: the OUT cell "ten" is not a number/);
  });
});

describe("sim identify", () => {
  it("prints the identified models as JSON, exit 0", async () => {
    expect(await runIdentifyCommand([file("good.csv", csv), "--fopdt-only"])).toBe(0);
    const j = JSON.parse(out);
    expect(j.fopdt.model.gainCPerPercent).toBeCloseTo(0.8, 1);
    expect(j.fopdt.model.deadTimeS).toBeGreaterThan(13);
    expect(j.columns).toEqual({ time: "time_s", out: "OUT %", pv: "PV (°C)" });
    expect(j.proposal.recommended.tuning.rule).toBe("amigo");
  }, 30_000);

  it.each([
    ["no step", "t,out,pv\n" + rec.t.map((t, i) => `${t},20,${rec.pv[i]}`).join("\n"), /no step in OUT/],
    ["unreadable columns", "a,b,c\n1,2,3\n", /cannot find the time, OUT, PV column/],
    ["too few points", "t,out,pv\n0,20,45\n1,50,45\n2,50,46\n", /too few points/],
    ["a bad cell", "t,out,pv\n0,20,45\n1,x,45\n", /not a number/],
  ])("%s: a clear message on stderr, exit 2", async (_name, text, msg) => {
    expect(await runIdentifyCommand([file("bad.csv", text)])).toBe(2);
    expect(err).toMatch(msg);
    expect(out).toBe("");
  });

  it("usage errors exit 1; a missing file exits 2", async () => {
    expect(await runIdentifyCommand([])).toBe(1);
    expect(await runIdentifyCommand([file("x.csv", csv), "--form", "diagonal"])).toBe(1);
    expect(await runIdentifyCommand([join(dir, "nope.csv")])).toBe(2);
    expect(err).toMatch(/cannot read/);
  });
});

describe("sim autotune", () => {
  const drillFile = () =>
    file(
      "drill.json",
      JSON.stringify({
        formatVersion: 1, id: "autotune-test", title: "autotune test",
        plant: { kind: "transfer-function", gainCPerPercent: 1, timeConstantsS: [60], deadTimeS: 8, operatingPoint: { outPercent: 50, temperatureC: 80 }, ambientC: 20 },
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "manual", setpointC: 80 },
        events: [{ type: "setpoint", timeS: 100, setpointC: 90 }],
        scoring: { windows: [{ id: "w", kind: "setpoint", startS: 0, endS: 600 }] },
        referenceTuning: { kind: "pid", kc: 2, ti: 60, sampleTimeS: 0.2 },
        drive: { kind: "continuous" },
        sensor: { noise: { sdMa: 0.002 } },
        cutout: { enabled: false, tripPointC: 300 },
        durationS: 600,
      }),
    );

  it("relay: Ku, Pu and a tuning in the requested form; the drill's events are not applied", async () => {
    expect(await runAutotuneCommand([drillFile(), "--method", "relay", "--form", "parallel"])).toBe(0);
    const j = JSON.parse(out);
    expect(j.relay.ku).toBeGreaterThan(3);
    expect(j.relay.puS).toBeGreaterThan(20);
    expect(j.recommended.conversion.tuning.form).toBe("parallel");
    expect(j.notes.join(" ")).toMatch(/not applied/);
  }, 30_000);

  it("bump: identified model and tuning; series form of a rule with Ti < 4Td says 'not representable' (exit 4)", async () => {
    expect(await runAutotuneCommand([drillFile(), "--method", "bump", "--controller", "PI"])).toBe(0);
    const j = JSON.parse(out);
    expect(j.bump.fopdt.model.gainCPerPercent).toBeCloseTo(1, 1);
    out = "";
    expect(await runAutotuneCommand([drillFile(), "--method", "relay", "--rule", "ziegler-nichols-no-overshoot", "--form", "series"])).toBe(4);
    expect(err).toMatch(/not representable/);
  }, 60_000);

  it("usage and input errors", async () => {
    expect(await runAutotuneCommand([drillFile()])).toBe(1); // no --method
    expect(await runAutotuneCommand([drillFile(), "--method", "relay", "--rule", "guesswork"])).toBe(1);
    expect(await runAutotuneCommand([file("bad.json", "{ not json"), "--method", "relay"])).toBe(2);
    expect(await runAutotuneCommand([file("bad2.json", JSON.stringify({ formatVersion: 1 })), "--method", "bump"])).toBe(2);
    expect(err).toMatch(/invalid drill/);
  });
});
