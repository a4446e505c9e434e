/**
 * Issue 12: the trail names its sources in words a buyer can look up (a standard, a textbook,
 * "common practice"), never an internal section number of our research notes, and warnings read
 * as sentences, not code names. Checked over random axes and over the named machines.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { sizeMachine, type Design, type MachineDesign } from "~/hydraulics";
import { forEveryDesign } from "../../support/hydraulics";
import { pressAxisArb, requirementsArb } from "./arbitraries";
import { CLAMP, CLAMP_AND_PRESS, FEED } from "../../support/machines";

// "§11.6", "sources 9", "S24": references only our research notes resolve.
const INTERNAL_REFERENCE = /§|\bsources? \d|\bS\d{1,2}\b/;

function wordsOnly(d: Design | MachineDesign) {
  for (const t of d.trail) {
    expect(t.source, t.quantity).not.toMatch(INTERNAL_REFERENCE);
    expect(t.source.trim().length, t.quantity).toBeGreaterThan(0);
    expect(t.formula, t.quantity).not.toMatch(INTERNAL_REFERENCE);
  }
  for (const w of d.warnings) {
    expect(w.message, w.code).not.toMatch(INTERNAL_REFERENCE);
    // a sentence: starts with a capital or a figure, ends with a full stop, and is not the code itself
    expect(w.message, w.code).toMatch(/^[A-Z0-9"'].*[.)]$/s);
    expect(w.message).not.toContain(w.code);
  }
}

describe("trail sources and warnings in words a reader can look up", () => {
  it("every axis, with and without a pressing stroke", () => {
    forEveryDesign(fc.oneof(requirementsArb, pressAxisArb), (d) => wordsOnly(d), 80);
  });

  it("the worked-example machines: a clamp and a press in turn; a feed and two clamps closing together", () => {
    const clamps = [
      { ...CLAMP, name: "Clamp A" },
      { ...CLAMP, name: "Clamp B" },
    ];
    const together = (motion: string) => clamps.map((c) => ({ axis: c.name, motion }));
    const sequence = [together("extend"), [{ axis: "Feed", motion: "extend" }], [{ axis: "Feed", motion: "retract" }], together("retract")];
    const feedAndClamps = { ...CLAMP_AND_PRESS, axes: [FEED, ...clamps], sequence };
    for (const m of [CLAMP_AND_PRESS, feedAndClamps]) wordsOnly(sizeMachine(m));
  });
});
