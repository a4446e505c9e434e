/**
 * The cylinder search decides with the same actual line losses the design reports (Darcy–Weisbach
 * at each line's real flow and hose), so it never picks a larger cylinder than the engine's own
 * check accepts. Before engine 2.0 the search charged every line the loss of the smallest hose at
 * its velocity limit, 5–13 bar too much, and about one random axis in seven got a size step more.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseRequirements, sizeCircuit } from "~/hydraulics";
import { cylinderCandidates } from "~/hydraulics/cylinder";
import { evaluateCandidate, sizingContext } from "~/hydraulics/evaluate";
import { requirementsArb } from "./arbitraries";

describe("the cylinder search", () => {
  it("never chooses a larger bore than the smallest pair the actual-loss check accepts", () => {
    fc.assert(
      fc.property(requirementsArb, (input) => {
        const ctx = sizingContext(parseRequirements(input));
        const accepted = cylinderCandidates().find((cyl) => {
          const ev = evaluateCandidate(ctx, cyl);
          return ev.pressureOk && ev.cbvOk && ev.bucklingOk;
        });
        if (!accepted) return;
        const d = sizeCircuit(input);
        expect(d.cylinder.boreMm, `${accepted.boreMm}/${accepted.rodMm} passes`).toBeLessThanOrEqual(accepted.boreMm);
      }),
      { numRuns: 400, seed: 12 },
    );
  });
});
