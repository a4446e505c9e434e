/**
 * The pressing-speed control's bypass in the approach (engine 2.11). A meter-in flow control in
 * the cap line sets the pressing speed; during the approach a 2/2 solenoid valve bypasses it, and
 * the approach flow crosses that valve. Its drop is a valve allowance at its sized flow (common
 * practice, as for a directional-valve path), scaled with the square of the flow (orifice equation,
 * Δp ∝ Q²); the bypass is sized for the approach flow it passes, so the whole allowance counts.
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit, type Design, type RequirementsInput } from "~/hydraulics";
import { A } from "~/hydraulics/assumptions";
import { cylinderCandidates } from "~/hydraulics/cylinder";
import { evaluateCandidate, sizingContext } from "~/hydraulics/evaluate";
import { DEFAULT_FLUID, lineLossBar } from "~/hydraulics/lines";
import { pressBypassDropBar } from "~/hydraulics/press-speed";
import { parseRequirements } from "~/hydraulics/requirements";
import { REFERENCE_PRESS } from "../../support/hydraulics";

// The shared sources' two-speed press: 100 kN over the last 20 mm of a 400 mm stroke, approach 200 mm/s.
const PRESS: RequirementsInput = { ...REFERENCE_PRESS, dwellS: 3 };

/** The design's own cylinder evaluated again, to see its losses term by term. */
function evaluationOf(req: RequirementsInput, d: Design) {
  const ctx = sizingContext(parseRequirements(req));
  const cyl = cylinderCandidates().find((c) => c.boreMm === d.cylinder.boreMm && c.rodMm === d.cylinder.rodMm && c.series === d.cylinder.series)!;
  return evaluateCandidate(ctx, cyl, d.lines.pressure.hoseIndex - evaluateCandidate(ctx, cyl).lines.pressure.hoseIndex, d.regenerative);
}

describe("the bypass valve's drop is part of the approach pressure", () => {
  it("scales with Q² through the same valve (orifice equation) and is the whole allowance at its sized flow", () => {
    expect(pressBypassDropBar(94.25)).toBe(A.dcvPathDropBar.value);
    // half the flow through the same valve: a quarter of the drop
    expect(pressBypassDropBar(47.125, 94.25)).toBeCloseTo(A.dcvPathDropBar.value / 4, 12);
    expect(() => pressBypassDropBar(10, 0)).toThrow(/sized flow/);
  });

  it("a fixed pump's approach: pressure line + valve P→A + cap line + the bypass, at Q_p", () => {
    const req = { ...PRESS, pumpType: "fixed" } as const;
    const d = sizeCircuit(req);
    expect(d.pressSpeedControl).not.toBeNull();
    expect(d.pressSpeedControl!.bypassDropBar).toBe(A.dcvPathDropBar.value);
    const ev = evaluationOf(req, d);
    const qp = d.flowsLpm.pump;
    const withoutBypass = lineLossBar(d.lines.pressure, qp, DEFAULT_FLUID) + A.dcvPathDropBar.value + lineLossBar(d.lines.capWork, qp, DEFAULT_FLUID);
    expect(ev.extendSupplyLossBar).toBeCloseTo(withoutBypass + A.dcvPathDropBar.value, 9);
    // p_approach = p1 + supply losses (force balance and losses [D])
    expect(d.pressuresBar.approach).toBeCloseTo(ev.extendInletBar + withoutBypass + A.dcvPathDropBar.value, 9);
    // the trail names it twice: in the supply losses and as its own line
    const supply = d.trail.find((e) => e.quantity === "extend supply losses")!;
    expect(supply.formula).toMatch(/bypass/);
    expect(supply.inputs.bypass.value).toBe(A.dcvPathDropBar.value);
    expect(d.trail.some((e) => e.quantity === "drop across the flow control's bypass in the approach" && e.value === A.dcvPathDropBar.value)).toBe(true);
  });

  it("no bypass, no drop, where a double pump's small section gives the pressing speed itself", () => {
    // pressing at 11.5 mm/s on a 100 bore is 5.42 L/min; the 4 cm³/rev section's 5.51 L/min is within 10 % (our convention)
    const req = { ...PRESS, pressSpeedMmS: 11.5, pumpType: "double" } as const;
    const d = sizeCircuit(req);
    expect(d.pump.type).toBe("double");
    expect(d.pressSpeedControl).toBeNull();
    const ev = evaluationOf(req, d);
    expect(ev.pressBypassDropBar).toBe(0);
    const qp = d.flowsLpm.pump;
    expect(ev.extendSupplyLossBar).toBeCloseTo(
      lineLossBar(d.lines.pressure, qp, DEFAULT_FLUID) + A.dcvPathDropBar.value + lineLossBar(d.lines.capWork, qp, DEFAULT_FLUID),
      9,
    );
  });
});
