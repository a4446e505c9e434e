// Fails a test that logs an unannounced console.error (see tests/support/console-errors.ts);
// one logged outside any test fails the file. console.error is wrapped directly, not with
// vi.spyOn, so a test's own spies and vi.restoreAllMocks() leave the guard in place.
import { afterAll, afterEach, beforeEach } from "vitest";
import { beginTest, endScope, noteConsoleError } from "../support/console-errors";

const original = console.error;
console.error = (...args: unknown[]) => {
  if (!noteConsoleError(args)) original(...args);
};

beforeEach(() => beginTest());

afterEach(() => {
  const problems = endScope("test");
  if (problems) throw new Error(problems);
});

afterAll(() => {
  console.error = original;
  const problems = endScope("file");
  if (problems) throw new Error(problems);
});
