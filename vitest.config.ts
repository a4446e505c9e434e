import { defineConfig } from "vitest/config";

// Vitest gets its own config: the reactRouter() plugin is for the app build, not for tests.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx", "app/**/*.test.ts"],
    globalSetup: ["tests/setup/global-setup.ts"],
    setupFiles: ["tests/setup/each-file.ts", "tests/setup/console-guard.ts"],
    reporters: ["default", "./tests/setup/summary-reporter.ts"],
    testTimeout: 20_000,
    // Browser and HTTP tests share two cores with each other: give a page time to answer.
    expect: { poll: { timeout: 5_000 } },
    hookTimeout: 60_000,
  },
});
