import { describe, expect, it } from "vitest";
import { readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { guessMappingForText, importLog, MAX_UPLOAD_BYTES } from "@/sim/import";
import { identifyStepResponse } from "@/sim/tuning/identify";
import { SAMPLE_PLANTS, sampleFiles } from "@/sim/import/fixtures/sample-logs";

const dir = join(process.cwd(), "public", "samples");
const read = (name: string) => readFileSync(join(dir, name), "utf8");
const rel = (x: number, ref: number) => Math.abs(x / ref - 1);

function load(name: string) {
  const text = read(name);
  const g = guessMappingForText(text);
  if (!g.ok) throw new Error(g.message);
  return { mapping: g.mapping, result: importLog(text, Buffer.byteLength(text), g.mapping) };
}

function loaded(name: string) {
  const { mapping, result } = load(name);
  if (!result.ok) throw new Error(result.message);
  return { mapping, ...result };
}

describe("example logs in public/samples (invented data)", () => {
  it("are what the generator writes, each under 200 kB, with a README saying they are invented", () => {
    for (const [name, text] of Object.entries(sampleFiles())) {
      expect(read(name), `${name} is stale: run npx tsx sim/import/fixtures/generate-samples.ts`).toBe(text);
      expect(statSync(join(dir, name)).size).toBeLessThan(Math.min(200_000, MAX_UPLOAD_BYTES));
    }
    expect(read("README.md")).toMatch(/All of these files are invented example data/);
  });

  // True plants are ours (sim/import/fixtures/sample-logs.ts); the fit tolerances are our choice.
  it("dryer-bump-irregular.csv: irregular 2 s sampling, 0.1 °C resolution, SOPDT recovered", () => {
    const { mapping, log, summary } = loaded("dryer-bump-irregular.csv");
    expect(mapping).toMatchObject({ delimiter: ",", decimalMark: ".", timeFormat: "seconds", temperatureUnit: "C" });
    expect(summary.irregular).toBe(true);
    expect(summary.medianIntervalS).toBeCloseTo(2, 0);
    expect(summary.gaps).toEqual([]);
    expect(Math.abs(summary.quantizationStepC! / 0.1 - 1)).toBeLessThan(0.01);
    expect(summary.step.outBeforePercent).toBeCloseTo(25, 0);
    expect(summary.step.outAfterPercent).toBeCloseTo(40, 0);
    const id = identifyStepResponse(log);
    expect(id.ok).toBe(true);
    if (!id.ok) return;
    expect(id.preferred).toBe("sopdt");
    const m = id.sopdt!.model;
    const p = SAMPLE_PLANTS.dryer;
    expect(rel(m.gainCPerPercent, p.gainPerPercent)).toBeLessThan(0.02);
    expect(rel(m.timeConstant1S, p.tau1S)).toBeLessThan(0.05);
    expect(rel(m.timeConstant2S, p.tau2S)).toBeLessThan(0.1);
    expect(Math.abs(m.deadTimeS - p.deadTimeS)).toBeLessThan(3);
    expect(id.sopdt!.quality.r2).toBeGreaterThan(0.999);
  });

  it("cabinet-bump-decimal-comma.csv: ';' and decimal comma, dd.mm.yyyy times, the 2-minute dropout found", () => {
    const { mapping, log, summary } = loaded("cabinet-bump-decimal-comma.csv");
    expect(mapping).toMatchObject({ delimiter: ";", decimalMark: ",", timeFormat: "timestamp", temperatureUnit: "C" });
    expect(summary.startedAt).toBe("2026-03-04T07:40:00");
    expect(summary.medianIntervalS).toBe(5);
    expect(summary.gaps).toEqual([{ atS: 1500, lengthS: 120 }]);
    expect(summary.irregular).toBe(false);
    const id = identifyStepResponse(log);
    expect(id.ok).toBe(true);
    if (!id.ok) return;
    const p = SAMPLE_PLANTS.cabinet;
    expect(rel(id.fopdt.model.gainCPerPercent, p.gainPerPercent)).toBeLessThan(0.02);
    expect(rel(id.fopdt.model.timeConstantS, p.tau1S)).toBeLessThan(0.05);
    // an FOPDT fit takes a short second lag largely into its dead time, θ ≈ θ + τ2 (common practice)
    expect(Math.abs(id.fopdt.model.deadTimeS - (p.deadTimeS + p.tau2S))).toBeLessThan(6);
    expect(id.fopdt.quality.r2).toBeGreaterThan(0.999);
  });

  it("oven-bump-fahrenheit.tsv: tab, ISO times, °F converted to °C by (°F − 32)/1.8 (NIST SP 811, Appendix B, from memory)", () => {
    const { mapping, log, summary } = loaded("oven-bump-fahrenheit.tsv");
    expect(mapping).toMatchObject({ delimiter: "\t", timeFormat: "timestamp", temperatureUnit: "F", columns: { time: 0, sp: 1, pv: 2, out: 3, mode: 4 } });
    const firstPvF = Number(read("oven-bump-fahrenheit.tsv").split("\n")[1].split("\t")[2]);
    expect(log.pv[0]).toBeCloseTo((firstPvF - 32) / 1.8, 10);
    expect(log.sp![0]).toBeCloseTo(176.6667, 4); // 350 °F
    expect(log.mode!.every((m) => m === "manual")).toBe(true);
    expect(summary.medianIntervalS).toBeCloseTo(1.5, 9);
    expect(summary.quantizationStepC).toBeCloseTo(0.1 / 1.8, 6); // 0.1 °F in °C
    const id = identifyStepResponse(log);
    expect(id.ok).toBe(true);
    if (!id.ok) return;
    const p = SAMPLE_PLANTS.oven;
    const best = id.preferred === "sopdt" ? id.sopdt! : id.fopdt;
    expect(rel(best.model.gainCPerPercent, p.gainPerPercent / 1.8)).toBeLessThan(0.02);
    expect(best.quality.r2).toBeGreaterThan(0.999);
  });

  it("the broken examples are refused with the reason and, where there is one, the line", () => {
    const expected: Record<string, [string, RegExp]> = {
      "broken-no-step.csv": ["no-step", /stays between 30 and 30\.1 %/],
      "broken-pv-flat.csv": ["pv-flat", /PV is flat/],
      "broken-non-numeric.csv": ["non-numeric", /^line 14, column "pv_C": "Err" is not a number$/],
      "broken-time-backwards.csv": ["time-not-increasing", /^line 43: time does not increase/],
    };
    for (const [name, [code, message]] of Object.entries(expected)) {
      const { result } = load(name);
      expect(result.ok, name).toBe(false);
      if (result.ok) continue;
      expect(result.code, name).toBe(code);
      expect(result.message, name).toMatch(message);
    }
  });
});
