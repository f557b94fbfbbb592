import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import * as engine from "@/sim/index";

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith(".ts") ? [p] : [];
  });
}

// Brief, architecture: the engine is pure TypeScript (no React, DOM or Node imports) so the same
// code runs in the Web Worker and on the server; only sim/cli and sim/perf wrap it for Node.
describe("engine purity", () => {
  const mine = ["plant", "actuator", "safety", "drill"].flatMap((d) => files(join(process.cwd(), "sim", d)));
  mine.push(join(process.cwd(), "sim/index.ts"), join(process.cwd(), "sim/version.ts"));
  it.each(mine.map((f) => f.slice(process.cwd().length + 1)))("%s imports no Node, React or DOM module", (f) => {
    const src = readFileSync(join(process.cwd(), f), "utf8");
    const imports = [...src.matchAll(/from\s+"([^"]+)"/g)].map((m) => m[1]);
    for (const m of imports) {
      expect(m.startsWith("node:") || ["fs", "path", "os", "child_process", "react", "react-dom"].includes(m)).toBe(false);
    }
    expect(/\b(window|document|process)\./.test(src.replace(/\/\/.*$|\/\*[\s\S]*?\*\//gm, ""))).toBe(false);
  });

  it("the public index exports the runner, the drill format and the presets", () => {
    expect(typeof engine.Simulation).toBe("function");
    expect(typeof engine.runDrill).toBe("function");
    expect(typeof engine.drillSchema.parse).toBe("function");
    expect(engine.PLANT_PRESETS.length).toBe(3);
    expect(typeof engine.ENGINE_VERSION).toBe("string");
    expect(typeof engine.SensorChain).toBe("function");
    expect(typeof engine.ControllerBlock).toBe("function");
    expect(typeof engine.computeWindowResults).toBe("function");
  });
});
