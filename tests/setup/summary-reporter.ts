import type { Reporter, TestModule } from "vitest/node";

// One plain closing line, "Tests: N passed, N failed", that any CI log reader understands.
export default class SummaryReporter implements Reporter {
  onTestRunEnd(testModules: ReadonlyArray<TestModule>) {
    let passed = 0;
    let failed = 0;
    let skipped = 0;
    for (const module of testModules) {
      for (const test of module.children.allTests()) {
        const state = test.result().state;
        if (state === "passed") passed++;
        else if (state === "failed") failed++;
        else skipped++;
      }
    }
    // A file whose setup failed runs none of its tests: count it, or the line would read "0 failed".
    const brokenFiles = testModules.filter((m) => m.state() === "failed" && [...m.children.allTests("failed")].length === 0).length;
    process.stdout.write(
      `\nTests: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}${brokenFiles ? `; ${brokenFiles} test file${brokenFiles === 1 ? "" : "s"} failed to run` : ""}\n`,
    );
  }
}
