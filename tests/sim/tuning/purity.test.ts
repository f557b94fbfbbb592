import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import * as toolkit from "@/sim/tuning";

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith(".ts") ? [p] : [];
  });
}

// Brief, architecture: sim/ is pure TypeScript (no React, DOM or Node imports) so the toolkit runs
// in the Bench's Web Worker, on the server and in the CLI alike.
describe("tuning toolkit purity", () => {
  const all = files(join(process.cwd(), "sim", "tuning")).map((f) => f.slice(process.cwd().length + 1));
  it.each(all)("%s imports no Node, React or DOM module", (f) => {
    const src = readFileSync(join(process.cwd(), f), "utf8");
    for (const m of [...src.matchAll(/from\s+"([^"]+)"/g)].map((x) => x[1]))
      expect(m.startsWith("node:") || ["fs", "path", "os", "child_process", "react", "react-dom"].includes(m)).toBe(false);
    expect(/\b(window|document|process)\./.test(src.replace(/\/\/.*$|\/\*[\s\S]*?\*\//gm, ""))).toBe(false);
  });

  it("the index exports the toolkit", () => {
    for (const name of ["RelayTest", "BumpTest", "identifyStepResponse", "computeMargins", "powerCurve", "toBlockForm", "allTunings", "propose"] as const)
      expect(typeof (toolkit as Record<string, unknown>)[name]).toBe("function");
  });
});
