import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL(".", import.meta.url));

// Four projects: pure unit tests (sim/ and helpers), component tests in jsdom, integration tests
// against a real PostgreSQL database, and browser end-to-end tests against the production build.
// tests/run-all.ts provides the database and the running app for the last two. groupOrder runs
// them one after another (pure tests first, then the database, then the browser), so the 2-core
// machine is not shared between chromium, the app server and CPU-heavy unit tests.
export default defineConfig({
  plugins: [react()],
  resolve: { alias: { "@": root } },
  test: {
    projects: [
      {
        extends: true,
        test: { name: "unit", environment: "node", include: ["tests/sim/**/*.test.ts", "tests/unit/**/*.test.ts"], sequence: { groupOrder: 0 } },
      },
      {
        extends: true,
        test: {
          name: "components",
          environment: "jsdom",
          globals: true,
          include: ["tests/components/**/*.test.tsx"],
          sequence: { groupOrder: 0 },
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          environment: "node",
          include: ["tests/integration/**/*.test.ts"],
          fileParallelism: false,
          sequence: { groupOrder: 1 },
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          environment: "node",
          include: ["tests/e2e/**/*.test.ts"],
          fileParallelism: false,
          sequence: { groupOrder: 2 },
          testTimeout: 90_000,
          hookTimeout: 90_000,
        },
      },
    ],
  },
});
