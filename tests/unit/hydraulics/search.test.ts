/**
 * The sizing search decides with searchCheck, a lean copy of evaluateCandidate's search mode
 * (budgeted line losses); the full evaluation stays the reference. Both must agree on every
 * bore/rod pair for every axis, or the lean copy would pick a different cylinder.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseRequirements } from "~/hydraulics";
import { cylinderCandidates } from "~/hydraulics/cylinder";
import {
  SEARCH_BUCKLING_OK, SEARCH_CBV_OK, SEARCH_PRESSURE_OK, evaluateCandidate, searchCheck, sizingContext,
} from "~/hydraulics/evaluate";
import { requirementsArb } from "./arbitraries";

describe("the search's lean check", () => {
  it("gives the same pressure, counterbalance and buckling verdicts as the full search-mode evaluation", () => {
    fc.assert(
      fc.property(requirementsArb, (input) => {
        const ctx = sizingContext(parseRequirements(input));
        for (const cyl of cylinderCandidates(ctx.series)) {
          const ev = evaluateCandidate(ctx, cyl, true);
          const expected =
            (ev.pressureOk ? SEARCH_PRESSURE_OK : 0) | (ev.cbvOk ? SEARCH_CBV_OK : 0) | (ev.bucklingOk ? SEARCH_BUCKLING_OK : 0);
          expect(searchCheck(ctx, cyl), `${cyl.boreMm}/${cyl.rodMm}`).toBe(expected);
        }
      }),
      { numRuns: 300 },
    );
  });
});
