// The console.error guard's state (tests/setup/console-guard.ts installs it): a test that logs
// an error it did not announce fails, so a swallowed failure cannot hide behind a green run.
import { format } from "node:util";

type Scope = "test" | "file";

interface GuardState {
  inTest: boolean;
  expected: { pattern: RegExp; scope: Scope; seen: number }[];
  unexpected: { text: string; scope: Scope }[];
}

// On globalThis, so the setup file and the test file share it whatever module copies they load.
const KEY = Symbol.for("tenderflow.consoleErrors");
const holder = globalThis as unknown as Record<symbol, GuardState | undefined>;
const state = (): GuardState => (holder[KEY] ??= { inTest: false, expected: [], unexpected: [] });

/**
 * Declares that the running test makes the app log an error whose text matches `pattern`
 * (called in beforeAll: anywhere in the file). Matching errors stay off the output, and the
 * test fails if none is logged, so the declaration cannot outlive the behaviour.
 */
export function expectConsoleError(pattern: RegExp) {
  const s = state();
  s.expected.push({ pattern, scope: s.inTest ? "test" : "file", seen: 0 });
}

/** Records one console.error call; true when it was announced (and so need not be shown). */
export function noteConsoleError(args: unknown[]): boolean {
  const s = state();
  const text = format(...args);
  const match = s.expected.find((e) => e.scope === "test" && e.pattern.test(text)) ?? s.expected.find((e) => e.pattern.test(text));
  if (match) match.seen += 1;
  else s.unexpected.push({ text, scope: s.inTest ? "test" : "file" });
  return Boolean(match);
}

export function beginTest() {
  state().inTest = true;
}

/** Closes a test (or the file) and says what went wrong in it, or null; a clean slate after. */
export function endScope(scope: Scope): string | null {
  const s = state();
  s.inTest = false;
  const problems = [
    ...s.unexpected.filter((u) => u.scope === scope).map((u) => `unexpected console.error: ${u.text.split("\n")[0]}`),
    ...s.expected.filter((e) => e.scope === scope && e.seen === 0).map((e) => `expected a console.error matching ${e.pattern}, but none was logged`),
  ];
  s.unexpected = s.unexpected.filter((u) => u.scope !== scope);
  s.expected = s.expected.filter((e) => e.scope !== scope);
  if (!problems.length) return null;
  return `${problems.join("\n")}\n(a test that means to cause an error says so first: expectConsoleError(/…/) from tests/support/console-errors.ts)`;
}
