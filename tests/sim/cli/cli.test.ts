import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ENGINE_VERSION } from "@/sim/version";

function sim(args: string[]) {
  return spawnSync("npx", ["tsx", "sim/cli/main.ts", ...args], { cwd: process.cwd(), encoding: "utf8", timeout: 120_000 });
}

describe("headless CLI (npm run sim)", () => {
  it("runs a valid drill and prints JSON results with the engine version", () => {
    const dir = mkdtempSync(join(tmpdir(), "lw-cli-"));
    const csv = join(dir, "trace.csv");
    const r = sim(["run", "sim/examples/noisy-failing-sensor.json", "--seed", "5", "--out", csv]);
    expect(r.status, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.engineVersion).toBe(ENGINE_VERSION);
    expect(out.seed).toBe(5);
    expect(out.results.windows.length).toBe(3);
    expect(typeof out.results.windows[0].trueTemperature.iae).toBe("number");
    expect(out.score.score).toBeGreaterThan(0);
    const lines = readFileSync(csv, "utf8").trim().split("\n");
    expect(lines[0]).toBe(`# engine ${ENGINE_VERSION}`);
    expect(lines.length).toBe(out.samples + 2);
  }, 120_000);

  it("names the bad field of an invalid drill and exits non-zero", () => {
    const dir = mkdtempSync(join(tmpdir(), "lw-cli-"));
    const f = join(dir, "bad.json");
    const d = JSON.parse(readFileSync("sim/examples/setpoint-ladder.json", "utf8"));
    d.scoring.windows[1].weight = -2;
    writeFileSync(f, JSON.stringify(d));
    const r = sim(["run", f]);
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain("scoring.windows.1.weight");
    expect(r.stdout).toBe("");
  }, 120_000);

  it("documents every command and option in --help", () => {
    const r = sim(["--help"]);
    expect(r.status).toBe(0);
    for (const w of ["run", "validate", "schema", "presets", "--seed", "--controller", "--actions", "--out", "--no-score", "--integrator"]) expect(r.stdout).toContain(w);
  }, 120_000);

  it("accepts a controller file and rejects unknown options", () => {
    const dir = mkdtempSync(join(tmpdir(), "lw-cli-"));
    const c = join(dir, "c.json");
    writeFileSync(c, JSON.stringify({ kind: "pid", kc: 10, ti: 300, sampleTimeS: 0.5 }));
    const ok = sim(["run", "sim/examples/setpoint-ladder.json", "--controller", c, "--no-score"]);
    expect(ok.status, ok.stderr).toBe(0);
    expect(JSON.parse(ok.stdout).controller.kc).toBe(10);
    const bad = sim(["run", "sim/examples/setpoint-ladder.json", "--fast"]);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain("--fast");
  }, 120_000);
});
