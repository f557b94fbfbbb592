import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith(".ts") ? [p] : [];
  });
}

// Brief, architecture: sim/ is pure (no React, DOM or Node imports) so the browser and the server
// action read uploads with the same code; the fixture writer is a Node script like sim/cli.
describe("sim/import purity", () => {
  const all = files(join(process.cwd(), "sim", "import"))
    .map((f) => f.slice(process.cwd().length + 1))
    .filter((f) => f !== "sim/import/fixtures/generate-samples.ts");
  it.each(all)("%s imports no Node, React or DOM module", (f) => {
    const src = readFileSync(join(process.cwd(), f), "utf8");
    for (const m of [...src.matchAll(/from\s+"([^"]+)"/g)].map((x) => x[1]))
      expect(m.startsWith("node:") || ["fs", "path", "os", "child_process", "react", "react-dom"].includes(m)).toBe(false);
    expect(/\b(window|document|process|Buffer)\./.test(src.replace(/\/\/.*$|\/\*[\s\S]*?\*\//gm, ""))).toBe(false);
  });
});
