import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL(".", import.meta.url));

// Tests across Galera nodes and app instances: only with the cluster that `npm run test:cluster`
// starts (it sets CLUSTER), so `npm test` and a bare `vitest run` leave them out.
const cluster = {
  extends: true as const,
  test: {
    name: "cluster",
    include: ["tests/cluster/**/*.test.ts"],
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 180_000,
    expect: { poll: { timeout: 30_000 } },
  },
};

export default defineConfig({
  resolve: {
    alias: [
      { find: /^@\//, replacement: `${root}` },
      { find: /^server-only$/, replacement: `${root}tests/support/server-only.ts` },
    ],
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: [
            "tests/lib/**/*.test.{ts,tsx}",
            "tests/lint/**/*.test.ts",
            "tests/components/**/*.test.tsx",
            "tests/hooks/**/*.test.{ts,tsx}",
          ],
          environment: "node",
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts", "tests/api/**/*.test.ts"],
          globalSetup: ["tests/support/require-services.ts"],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          globalSetup: ["tests/support/require-services.ts"],
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 120_000,
          // A page on a loaded 2-core machine can take more than the default 1 s to repaint; the
          // tests check behaviour (speed is measured by npm run bench:*), so polls wait longer.
          expect: { poll: { timeout: 10_000 } },
        },
      },
      ...(process.env.CLUSTER ? [cluster] : []),
    ],
  },
});
