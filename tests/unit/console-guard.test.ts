// The console.error guard itself (tests/setup/console-guard.ts): each test here reads the
// guard's verdict on itself by closing its scope early, then reopens it for the real check.
import { describe, expect, it } from "vitest";
import { beginTest, endScope, expectConsoleError } from "../support/console-errors";

/** What the guard would fail the running test with, leaving it a clean slate. */
function verdict() {
  const problems = endScope("test");
  beginTest();
  return problems;
}

describe("the console.error guard", () => {
  it("finds nothing wrong in a test that logs no error", () => {
    expect(verdict()).toBeNull();
  });

  it("fails a test on an error it did not announce, naming the error", () => {
    console.error("Mail delivery failed:", "connection refused");
    expect(verdict()).toMatch(/^unexpected console\.error: Mail delivery failed: connection refused/);
  });

  it("lets an announced error through, however often it comes", () => {
    expectConsoleError(/Stripe refused a retainer session/);
    console.error("Stripe refused a retainer session:", "timeout");
    console.error("Stripe refused a retainer session:", "timeout again");
    expect(verdict()).toBeNull();
  });

  it("fails a test whose announced error never comes, and one whose other error does", () => {
    expectConsoleError(/Sizing failed/);
    console.error("Could not delete stored file x");
    const problems = verdict();
    expect(problems).toMatch(/unexpected console\.error: Could not delete stored file x/);
    expect(problems).toMatch(/expected a console\.error matching \/Sizing failed\/, but none was logged/);
  });
});
