// Temporary skeleton runner; replaced by the full orchestration (database, app, browser).
import { spawnSync } from "node:child_process";
const r = spawnSync("npx", ["vitest", "run"], { stdio: "inherit" });
process.exit(r.status ?? 1);
