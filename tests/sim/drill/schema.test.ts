import { describe, expect, it } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { drillSchema, parseDrill, drillJsonSchemaText, drillJsonSchema, DRILL_FORMAT_VERSION } from "@/sim/drill";

const examplesDir = join(process.cwd(), "sim/examples");
const examples = readdirSync(examplesDir).filter((f) => f.endsWith(".json"));

describe("drill format", () => {
  it("ships at least three examples", () => {
    expect(examples.length).toBeGreaterThanOrEqual(3);
  });

  it.each(examples)("example %s validates against the drill schema", (f) => {
    const json = JSON.parse(readFileSync(join(examplesDir, f), "utf8"));
    const r = parseDrill(json);
    if (!r.ok) throw new Error(r.errors.join("\n"));
    expect(r.drill.formatVersion).toBe(DRILL_FORMAT_VERSION);
  });

  it.each(examples)("example %s uses only properties the JSON Schema declares, and all it requires", (f) => {
    const json = JSON.parse(readFileSync(join(examplesDir, f), "utf8")) as Record<string, unknown>;
    const schema = drillJsonSchema() as { properties: Record<string, unknown>; required: string[]; additionalProperties: boolean };
    for (const k of Object.keys(json)) expect(Object.keys(schema.properties)).toContain(k);
    for (const k of schema.required) expect(Object.keys(json)).toContain(k);
    expect(schema.additionalProperties).toBe(false);
  });

  it("the committed sim/drill/drill.schema.json is up to date (regenerate: npm run sim -- schema --out sim/drill/drill.schema.json)", () => {
    const committed = readFileSync(join(process.cwd(), "sim/drill/drill.schema.json"), "utf8");
    expect(committed).toBe(drillJsonSchemaText());
  });

  it("names the bad field of an invalid drill", () => {
    const good = JSON.parse(readFileSync(join(examplesDir, examples[0]), "utf8"));
    const bad = structuredClone(good);
    bad.events[0].timeS = -5;
    bad.referenceTuning.kc = "fast";
    const r = parseDrill(bad);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.some((e) => e.startsWith("events.0.timeS"))).toBe(true);
      expect(r.errors.some((e) => e.startsWith("referenceTuning.kc"))).toBe(true);
    }
  });

  it("requires a cutout when the plant is defined in full, and rejects windows past the end", () => {
    const base = JSON.parse(readFileSync(join(examplesDir, examples[0]), "utf8"));
    const d = { ...base, plant: { kind: "transfer-function", gainCPerPercent: 1, timeConstantsS: [100], deadTimeS: 5, operatingPoint: { outPercent: 0, temperatureC: 20 }, ambientC: 20 } };
    delete d.cutout;
    const r = drillSchema.safeParse(d);
    expect(r.success).toBe(false);
    expect(r.error?.issues.some((i) => i.path.join(".") === "cutout")).toBe(true);
    const w = structuredClone(base);
    w.scoring.windows[0].endS = base.durationS + 1;
    expect(parseDrill(w).ok).toBe(false);
  });

  it("rejects unknown fields (strict objects) and wrong format versions", () => {
    const base = JSON.parse(readFileSync(join(examplesDir, examples[0]), "utf8"));
    expect(parseDrill({ ...base, colour: "red" }).ok).toBe(false);
    expect(parseDrill({ ...base, formatVersion: 2 }).ok).toBe(false);
  });
});
