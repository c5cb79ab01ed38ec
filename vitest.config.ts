import { defineConfig } from "vitest/config";

const root = import.meta.dirname;

export default defineConfig({
  resolve: {
    alias: {
      "@": root,
      // `server-only` throws unless resolved under React's "react-server" condition, which Next sets
      // for server code. Tests import server modules directly, so they get the package's own empty
      // module (what that condition resolves to) instead of switching React itself to its server build.
      "server-only": `${root}/node_modules/server-only/empty.js`,
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["tests/unit/**/*.test.ts"], environment: "node" },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          // One template database and one mail catcher per run (global-setup.ts); each file
          // gets its own copy of the database and its own mailbox (setup.ts), so files run in parallel.
          globalSetup: ["tests/integration/global-setup.ts"],
          setupFiles: ["tests/integration/setup.ts"],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/browser/global-setup.ts"],
          // One app server is shared, so browser files run one after another.
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 300_000,
        },
      },
    ],
  },
});
