/**
 * The defects an experienced fluid-power engineer found in engine 1 (issue 12), each with a
 * check that failed before its fix. Sources are named beside each check.
 */
import { describe, expect, it } from "vitest";
import { NotSizableError, RequirementsError, sizeCircuit, type RequirementsInput } from "~/hydraulics";

const DUTY = { cyclesPerHour: 30, hoursPerDay: 8, supplyHz: 50 } as const;

describe("nothing in the series meets maxPressureBar (sizing contract: say so, never the largest size quietly)", () => {
  // 1.5 MN at 20 bar: even the largest bore in the list, 400 mm (A1 = 125 664 mm²), needs
  // 10·1 500 000/(0.95·125 664) = 125.6 bar while pressing (textbook F = η·p·A).
  const axis: RequirementsInput = {
    orientation: "horizontal", massKg: 100, processForceN: 1_500_000, strokeMm: 300, extendSpeedMmS: 20, retractSpeedMmS: 20,
    mounting: "fixed-fixed", maxPressureBar: 20, ...DUTY,
  };
  it("throws a NotSizableError, a RequirementsError naming maxPressureBar with the reason", () => {
    let error: unknown;
    try {
      sizeCircuit(axis);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(NotSizableError);
    expect(error).toBeInstanceOf(RequirementsError); // so forms and the API answer it as bad input, never a 500
    const e = error as NotSizableError;
    expect(e.warning.code).toBe("NO_CYLINDER_MEETS_PRESSURE");
    expect(e.fieldErrors.maxPressureBar[0]).toBe(e.warning.message);
    expect(e.warning.message).toMatch(/Allow at least 126 bar/);
  });
  it("a load beyond every cylinder's rating (5 MN needs 419 bar on 400 mm) says so without offering a pressure", () => {
    expect(() => sizeCircuit({ ...axis, processForceN: 5_000_000 })).toThrow(/more than any cylinder in the series is rated/);
  });
  it("the pressure it asks for is enough: sizing again at that pressure succeeds", () => {
    let message = "";
    try {
      sizeCircuit(axis);
    } catch (e) {
      message = (e as NotSizableError).warning.message;
    }
    const needed = Number(/Allow at least (\d+) bar/.exec(message)![1]);
    expect(needed).toBeGreaterThan(20);
    const d = sizeCircuit({ ...axis, maxPressureBar: needed });
    expect(Math.max(d.pressuresBar.extend, d.pressuresBar.retract)).toBeLessThanOrEqual(needed);
  });
});

describe("counterbalance valve for light loads (common practice minimum setting; statics)", () => {
  const vertical: RequirementsInput = {
    orientation: "vertical", rodDirection: "down", strokeMm: 300, extendSpeedMmS: 100, retractSpeedMmS: 100,
    mounting: "fixed-pinned", massKg: 0, ...DUTY,
  };
  it("zero mass: nothing can overrun, so no valve (and the centre unloads the pump)", () => {
    const d = sizeCircuit(vertical);
    expect(d.loads.overrunningStroke).toBeNull();
    expect(d.counterbalance).toBeNull();
    expect(d.bom.some((l) => l.key === "counterbalance-valve")).toBe(false);
  });
  it("a shallow incline whose weight the guide friction holds (tan 3° = 0.052 < μ 0.1): no valve", () => {
    const d = sizeCircuit({ ...vertical, orientation: "inclined", inclineDeg: 3, massKg: 500 });
    expect(d.loads.gravityAlongAxisN).toBeLessThan(d.loads.frictionN);
    expect(d.counterbalance).toBeNull();
  });
  it("a light hanging rod (2 kg) gets the 20 bar minimum setting, not 0.7 bar", () => {
    const d = sizeCircuit({ ...vertical, massKg: 2 });
    expect(1.3 * d.counterbalance!.loadPressureBar).toBeLessThan(1);
    expect(d.counterbalance!.settingBar).toBe(20);
  });
});
