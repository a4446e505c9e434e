/**
 * The defects an experienced fluid-power engineer found in engine 1 (issue 12), each with a
 * check that failed before its fix. Sources are named beside each check.
 */
import { describe, expect, it } from "vitest";
import { NotSizableError, RequirementsError, parseRequirements, sizeCircuit, type RequirementsInput } from "~/hydraulics";
import { cylinderCandidates } from "~/hydraulics/cylinder";
import { holdingFor } from "~/hydraulics/holding";
import { CLAMP_FEED, ROD_DOWN_PRESS } from "../../support/hydraulics";

const DUTY = { cyclesPerHour: 30, hoursPerDay: 8, supplyHz: 50 } as const;

describe("nothing in the series meets maxPressureBar (sizing contract: say so, never the largest size quietly)", () => {
  // 1.5 MN at 20 bar: even the largest bore in the list, 400 mm (A1 = 125 664 mm²), needs
  // 10·1 500 000/(0.95·125 664) = 125.6 bar while pressing (textbook F = η·p·A).
  const axis: RequirementsInput = {
    orientation: "horizontal",
    massKg: 100,
    processForceN: 1_500_000,
    strokeMm: 300,
    extendSpeedMmS: 20,
    retractSpeedMmS: 20,
    mounting: "fixed-fixed",
    maxPressureBar: 20,
    ...DUTY,
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
    orientation: "vertical",
    rodDirection: "down",
    strokeMm: 300,
    extendSpeedMmS: 100,
    retractSpeedMmS: 100,
    mounting: "fixed-pinned",
    massKg: 0,
    ...DUTY,
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

describe("the reservoir holds the oil the cylinder draws (continuity; 3–5 × pump flow, common practice)", () => {
  // 6 m vertical lift, 2 t, 30 mm/s, front flange: the engine picks 100/70 (buckling over 6 m), A_rod = π·70²/4 =
  // 3848.45 mm². Extended, the cap end holds A1·s = 47.1 L and the rod end gives back A3·s = 24.0 L:
  // the tank is down by A_rod·s = 3848.45·6000/10⁶ = 23.09 L. Pump 12.5 cm³/rev·1450·0.95 = 17.22 L/min;
  // 4 × 17.22 = 68.9 L was the whole tank before (70 L). Now 68.9 + 23.09 = 91.97 → 95 L.
  const d = sizeCircuit({
    orientation: "vertical",
    rodDirection: "up",
    massKg: 2000,
    strokeMm: 6000,
    extendSpeedMmS: 30,
    retractSpeedMmS: 30,
    mounting: "fixed-pinned",
    mountingStyle: "front-flange",
    cyclesPerHour: 10,
    hoursPerDay: 8,
    supplyHz: 50,
  });
  it("6 m lift: 23.1 L drawn is added to the 4 × pump-flow rule", () => {
    expect(d.cylinder.rodMm).toBe(70);
    expect(d.flowsLpm.pump).toBeCloseTo(17.22, 2);
    expect(d.reservoir.cylinderDrawL).toBeCloseTo(23.09, 2);
    expect(d.reservoir.volumeL).toBe(95);
    expect(d.reservoir.volumeL).toBeGreaterThanOrEqual(4 * d.flowsLpm.pump + d.reservoir.cylinderDrawL);
  });
});

describe("the cylinder series follows the pressure needed (ISO 6020-2 160 bar, ISO 6022 250 bar pairings [M])", () => {
  it("a small clamp allowed 210 bar gets a 25 mm medium-series cylinder, not the heavy series' 50 mm", () => {
    // 5 kN: 10·5000/(0.95·490.9) = 107.2 bar on 25/12 + friction; within 145.5 bar (160/1.1), so
    // the 160 bar series serves it; the heavy series starts at 50 mm.
    const d = sizeCircuit({
      orientation: "horizontal",
      massKg: 50,
      processForceN: 5000,
      strokeMm: 50,
      extendSpeedMmS: 50,
      retractSpeedMmS: 50,
      mounting: "fixed-fixed",
      cyclesPerHour: 60,
      hoursPerDay: 8,
      supplyHz: 50,
      maxPressureBar: 210,
    });
    expect(d.cylinder.boreMm).toBe(25);
    expect(d.cylinder.series).toBe("ISO 6020-2");
    expect(d.cylinder.ratedPressureBar).toBe(160);
    expect(d.pressuresBar.reliefSetting).toBeLessThanOrEqual(160);
  });
});

describe("a rod-side counterbalance valve is rated for the pump flow through its check (continuity)", () => {
  it("worked example 2's press: lifting sends the full 34.44 L/min through 2→1, more than the 27.46 L/min lowering", () => {
    // Q_p = 25 cm³/rev·1450·0.95 = 34.44 L/min; lowering 1→2 carries Q_p/φ = 34.44/1.2539 = 27.46 L/min.
    const d = sizeCircuit(ROD_DOWN_PRESS);
    expect(d.counterbalance!.flowLpm).toBeCloseTo(34.44, 2);
    expect(d.bom.find((l) => l.key === "counterbalance-valve")!.specification).toContain("at least 34.4 L/min");
  });
});

describe("every component a warning calls for is a line of the bill (sizing contract)", () => {
  it("a heat load the tank cannot shed gets design.cooler and a cooler line of that capacity", () => {
    // 45 °C air leaves 15 K to the 60 °C oil limit (ISO 4413 as paraphrased in University of
    // Minnesota course notes); k = 12 W/(m²·K) for a tank in free air (Matthies/Renius).
    const d = sizeCircuit({
      orientation: "horizontal",
      massKg: 500,
      processForceN: 100000,
      strokeMm: 300,
      extendSpeedMmS: 300,
      retractSpeedMmS: 300,
      mounting: "fixed-fixed",
      cyclesPerHour: 600,
      hoursPerDay: 16,
      supplyHz: 50,
      ambientC: 45,
    });
    expect(d.warnings.map((w) => w.code)).toContain("HEAT_COOLER_NEEDED");
    expect(d.cooler).not.toBeNull();
    expect(d.cooler!.kw).toBeCloseTo(d.heat.averageLossKw - d.heat.tankDissipationKw, 9);
    const line = d.bom.find((l) => l.key === "cooler")!;
    expect(line.rating).toEqual({ value: d.cooler!.kw, unit: "kW", label: "heat rejection" });
  });
});

describe("the motor sits where the fixed pump sits, and dwell is heat (shared sources' duty-cycle check values [D])", () => {
  // Sources' check value for a dwell over the relief: Q_p = 94.25 L/min at 140 bar is
  // 140·94.25/600 = 22.0 kW hydraulic, 25.9 kW at η 0.85, all of it heat.
  it("dwell heat is p_relief·Q_p/(600·η) and is averaged over the cycle", () => {
    // worked example 1's axis (without its front flange)
    const none = sizeCircuit(CLAMP_FEED);
    const dwell = sizeCircuit({ ...CLAMP_FEED, dwellS: 10 });
    // worked example 1's pump: 27.55 L/min, relief 145 bar → 145·27.55/600/0.85 = 7.833 kW while dwelling
    expect(dwell.heat.dwellLossKw).toBeCloseTo(7.833, 2);
    expect(dwell.heat.dwellShare).toBeCloseTo((60 * 10) / 3600, 9);
    // the dwell replaces neutral time, where the tandem centre unloads the pump
    expect(dwell.heat.averageLossKw - none.heat.averageLossKw).toBeCloseTo(((10 * 60) / 3600) * (7.833 - none.heat.neutralLossKw), 2);
  });
  it("with no pressing force and no dwell the motor follows the working pressure (the valve shifts back at the stroke end)", () => {
    // worked example 1's axis without its process force
    const { processForceN: _force, ...unloaded } = CLAMP_FEED;
    const d = sizeCircuit(unloaded);
    expect(d.motor.sizedAtRelief).toBe(false);
    expect(d.motor.sizingPressureBar).toBeCloseTo(Math.max(d.pressuresBar.extend, d.pressuresBar.retract), 9);
  });
});

describe("meter-out intensification is warned (force balance p2 = φ·p1 + F/A3; shared sources' example φ 2.04 × 120 bar = 245 bar)", () => {
  it("φ × relief above the rating without a rod-side counterbalance valve gives METER_OUT_INTENSIFICATION", () => {
    // 40 kN pusher, 1 m free rod end, front flange: buckling asks for 80/56 (φ = 80²/(80² − 56²) = 1.961), relief
    // 95 bar → a meter-out throttle could put 1.961 × 95 = 186.3 bar on a 160 bar cylinder.
    const d = sizeCircuit({
      orientation: "horizontal",
      massKg: 200,
      processForceN: 40000,
      strokeMm: 1000,
      extendSpeedMmS: 100,
      retractSpeedMmS: 100,
      mounting: "fixed-free",
      mountingStyle: "front-flange",
      cyclesPerHour: 30,
      hoursPerDay: 8,
      supplyHz: 50,
    });
    expect(d.cylinder.boreMm).toBe(80);
    expect(d.cylinder.rodMm).toBe(56);
    expect(d.pressuresBar.reliefSetting).toBe(95);
    const peak = d.cylinder.areaRatio * d.pressuresBar.reliefSetting;
    const warned = d.warnings.some((w) => w.code === "METER_OUT_INTENSIFICATION");
    expect(warned).toBe(peak > d.cylinder.ratedPressureBar);
    expect(warned).toBe(true);
    expect(peak).toBeCloseTo(186.3, 1);
    expect(d.warnings.find((w) => w.code === "METER_OUT_INTENSIFICATION")!.message).toContain("186.3 bar");
  });
});

describe("leak-tight holding for a load held at rest (sizing contract holdMinutes; shared sources' holding check values [D])", () => {
  // 100/70: A1 = 7853.98, A3 = 4005.53 mm², φ = 1.9608; pilot ratio 4:1 [CP].
  const cyl = cylinderCandidates().find((c) => c.boreMm === 100 && c.rodMm === 70 && c.series === "ISO 6020-2")!;
  const loads = (over: "extend" | "retract" | null, gravityN: number) =>
    ({
      angleDeg: 90,
      gravityAlongAxisN: gravityN,
      normalForceN: 0,
      frictionN: 0,
      processForceN: 0,
      extendGravitySign: over === "extend" ? -1 : 1,
      overrunningStroke: over,
    }) as const;
  const req = (holdMinutes: number, processForceN = 0) =>
    parseRequirements({
      orientation: "vertical",
      rodDirection: "down",
      massKg: 2000,
      processForceN,
      strokeMm: 400,
      extendSpeedMmS: 100,
      retractSpeedMmS: 100,
      mounting: "fixed-pinned",
      holdMinutes,
      ...DUTY,
    });
  it("rod end, 20 kN hanging: p1 = (F/A3)/(R − φ) = 24.5 bar, opening at p2 = F/A3 + φ·p1 = 97.9 bar", () => {
    const h = holdingFor(req(30), loads("extend", 20000), cyl, 50)!;
    expect(h.side).toBe("rod");
    expect(h.pilotRatio).toBe(4);
    expect(h.pilotOpeningBar).toBeCloseTo(24.5, 1);
    expect(h.openingLoadSideBar).toBeCloseTo(97.9, 1);
  });
  it("cap end, 20 kN lifted: p3 = (F/A1)/(R − 1/φ) = 7.30 bar", () => {
    const h = holdingFor(req(30), loads("retract", 20000), cyl, 50)!;
    expect(h.side).toBe("cap");
    expect(h.pilotOpeningBar).toBeCloseTo(7.3, 2);
  });
  it("a hold of a few minutes or less asks for none", () => {
    expect(holdingFor(req(5), loads("extend", 20000), cyl, 50)).toBeNull();
  });
  it("a clamp held 30 min gets a cap-end check valve, a float centre so its pilot vents, and a bill line", () => {
    const d = sizeCircuit({
      orientation: "horizontal",
      massKg: 100,
      processForceN: 30000,
      strokeMm: 100,
      extendSpeedMmS: 50,
      retractSpeedMmS: 50,
      mounting: "fixed-fixed",
      mountingStyle: "front-flange",
      holdMinutes: 30,
      ...DUTY,
    });
    expect(d.holding?.side).toBe("cap");
    expect(d.directionalValve.center).toBe("float");
    expect(d.reliefVent).not.toBeNull();
    const line = d.bom.find((l) => l.key === "holding-valve")!;
    expect(line.quantity).toBe(1);
    expect(line.specification).toContain("pilot ratio 4:1");
    expect(d.warnings.some((w) => w.code === "REQUIREMENT_NOT_YET_SIZED")).toBe(false);
  });
});

describe("a large press gets its decompression valve in the bill (sizing contract: every component a warning calls for)", () => {
  it("200 t down-stroking press with a 600 mm stroke", () => {
    const d = sizeCircuit({
      orientation: "vertical",
      rodDirection: "down",
      massKg: 2000,
      processForceN: 2_000_000,
      strokeMm: 600,
      extendSpeedMmS: 50,
      retractSpeedMmS: 80,
      mounting: "fixed-fixed",
      mountingStyle: "front-flange",
      maxPressureBar: 250,
      ...DUTY,
    });
    expect(d.decompression.needed).toBe(true);
    expect(d.warnings.some((w) => w.code === "DECOMPRESSION_NEEDED")).toBe(true);
    const line = d.bom.find((l) => l.key === "decompression-valve")!;
    expect(line.rating.value).toBeCloseTo(d.decompression.releaseCm3, 9);
    // ΔV = V·p/K: the cap end alone holds A1·s
    expect(d.decompression.releaseCm3).toBeGreaterThanOrEqual((((d.cylinder.capAreaMm2 * 600) / 1e6) * 1000 * d.decompression.pressureBar) / 6895);
  });
});
