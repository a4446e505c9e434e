/**
 * Motion phases of an extension with a pressing stroke (engine 2.8): an approach with no process
 * force, then the pressing stroke against it, then the dwell. Check values from the shared
 * sources' reference press axis (two-speed extension: 100 mm bore, 400 mm stroke, 100 kN,
 * approach 0.2 m/s, pressing 0.01 m/s), worked by hand; each step names its source.
 */
import { describe, expect, it } from "vitest";
import { sizeCircuit } from "~/hydraulics";
import { extensionTimes, phaseFlowLpm } from "~/hydraulics/phases";
import { REFERENCE_PRESS } from "../../support/hydraulics";

const A1_100 = (Math.PI * 100 ** 2) / 4; // 7853.98 mm², circle area [D]

describe("flows and times per phase (continuity, Q = A·v)", () => {
  it("gives the reference axis's 94.25 L/min approach and 4.71 L/min pressing flow", () => {
    // Q_app = 7853.98 mm² · 200 mm/s · 0.06 / 1000 = 94.25 L/min (continuity [D]; shared check value)
    expect(phaseFlowLpm(A1_100, 200)).toBeCloseTo(94.25, 2);
    // Q_press = 7853.98 · 10 · 0.06 / 1000 = 4.712 L/min (continuity [D]; shared check value 4.71)
    expect(phaseFlowLpm(A1_100, 10)).toBeCloseTo(4.712, 3);
  });
  it("splits the stroke into approach and pressing times, t = s / v", () => {
    // 400 mm stroke, last 20 mm pressing: approach 380 / 200 = 1.9 s, pressing 20 / 10 = 2 s [D]
    expect(extensionTimes(400, 20, 200, 10)).toEqual({ approachS: 1.9, pressS: 2 });
    // No pressing stroke: one phase over the whole stroke (version-1 behaviour) [D]
    expect(extensionTimes(400, 0, 200, undefined)).toEqual({ approachS: 2, pressS: 0 });
    expect(() => extensionTimes(400, 20, 200, 0)).toThrow(/pressing speed/);
  });
});

describe("worked example — the reference press axis with a 20 mm pressing stroke", () => {
  // Horizontal, m = 500 kg, μ = 0.1 (default), 100 kN process force, stroke 400 mm, approach
  // 200 mm/s, pressing the last 20 mm at 10 mm/s, retract 200 mm/s, 60 cycles/h, 50 Hz.
  // `base` is the reference press without its pressing stroke, as version 1 sized it.
  const { pressStrokeMm, pressSpeedMmS, ...base } = { ...REFERENCE_PRESS, mountingStyle: "front-flange" } as const;
  // A fixed pump is asked for here; the pump choice has its own worked examples.
  const d = sizeCircuit({ ...base, pressStrokeMm, pressSpeedMmS, pumpType: "fixed" });
  const v1 = sizeCircuit(base);

  it("chooses the 100 mm bore the pressing force needs (textbook F = η·p·A)", () => {
    // F_press = 100 000 + 0.1·500·9.80665 = 100 490.3 N; /η 0.95 = 105 779.3 N (statics [D]; η common practice [CP])
    // Ø80 needs 10·105 779.3/5026.5 = 210.4 bar > 145.45 limit; Ø100: 134.68 bar fits [D]
    expect(d.cylinder.boreMm).toBe(100);
  });

  it("reports per-phase flows and pressures, extend being the highest phase", () => {
    // Pressing flow on the chosen bore: 4.712 L/min (continuity [D]; shared check value 4.71)
    expect(d.flowsLpm.press).toBeCloseTo(phaseFlowLpm(d.cylinder.capAreaMm2, 10), 9);
    expect(d.flowsLpm.press).toBeCloseTo(4.712, 3);
    // Approach flow 94.25 L/min (shared check value), still flowsLpm.extend per the contract
    expect(d.flowsLpm.extend).toBeCloseTo(94.25, 2);
    // Pressing pressure: 10·105 779.3 / 7853.98 = 134.68 bar at the cylinder (force balance [D]),
    // plus losses at 4.7 L/min, which are small: valve drops scale with Q² (orifice equation [D]).
    // Shared check value with η = 1 and no losses: 127.3 bar; 127.3/0.95 = 134.0 bar plus friction.
    expect(d.pressuresBar.press!).toBeGreaterThan(134.68);
    expect(d.pressuresBar.press!).toBeLessThan(134.68 + 0.5);
    // Approach: friction 490.3 N plus m·a, no process force (force balance [D]): far below pressing
    expect(d.pressuresBar.approach!).toBeLessThan(20);
    expect(d.pressuresBar.approach).toBe(d.pressuresBar.extendMoving);
    expect(d.pressuresBar.extend).toBe(Math.max(d.pressuresBar.approach!, d.pressuresBar.press!));
  });

  it("counts the pressing time in the duty and its heat (energy balance)", () => {
    // Pressing share = 60/h · (20 mm / 10 mm/s) / 3600 = 0.03333 [D]
    expect(d.heat.pressShare).toBeCloseTo((60 * 2) / 3600, 9);
    // Approach share = 60 · (380 / v_actual) / 3600 with v_actual = Q_p / A1 (continuity [D])
    const vActual = (d.flowsLpm.pump * 1000) / (d.cylinder.capAreaMm2 * 0.06);
    expect(d.heat.extendShare).toBeCloseTo((60 * 380) / vActual / 3600, 9);
    // A fixed pump sits at the relief while pressing (trade-press pump articles [S]):
    // heat = p_RV·Q_p/(600·0.85) − F·v = input power less the work on the process force [D]
    const expected = (d.pressuresBar.reliefSetting * d.flowsLpm.pump) / 600 / 0.85 - (d.loads.extendPressN * 10) / 1e6;
    expect(d.heat.pressLossKw).toBeCloseTo(expected, 9);
    expect(d.heat.pressLossKw).toBeGreaterThan(0);
  });

  it("no longer names the pressing stroke as not yet sized", () => {
    expect(d.warnings.some((w) => w.code === "REQUIREMENT_NOT_YET_SIZED")).toBe(false);
  });

  it("without a pressing stroke behaves as before: no phase fields, no pressing time", () => {
    expect(v1.flowsLpm.press).toBeUndefined();
    expect(v1.pressuresBar.approach).toBeUndefined();
    expect(v1.pressuresBar.press).toBeUndefined();
    expect(v1.heat.pressShare).toBe(0);
    expect(v1.heat.pressLossKw).toBe(0);
    // the force at standstill, no losses (version-1 behaviour): 134.68 bar [D]
    expect(v1.pressuresBar.extendPress).toBeCloseTo(134.68, 2);
  });
});
