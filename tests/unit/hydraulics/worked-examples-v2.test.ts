/**
 * Worked examples by hand for engine 2.10: the two-speed reference press with each pump type
 * (how the pressing speed is set, what each pump loses while pressing, dwelling and at rest), a
 * clamp held for an hour, and a load lowered fast. Every number below is worked from a formula
 * in the comment beside it, with its source; the engine's value is then held to it with a
 * tolerance that says what it absorbs. Where a step needs a number the engine worked out with
 * line losses (a few hundredths of a bar at the pressing flow), the comment says so and the hand
 * formula is applied to it.
 *
 * Already covered elsewhere, and not repeated here: the flows and pressing pressure of this axis
 * with a fixed pump (motion-phases.test.ts), the pump choice and its unit check values and the
 * 2 t / 150 kN press (pump-choice.test.ts), each pump type's delivery per cycle phase (cycle.test.ts).
 */
import { describe, expect, it } from "vitest";
import { parseRequirements, sizeCircuit, type Design, type RequirementsInput } from "~/hydraulics";
import { cylinderCandidates } from "~/hydraulics/cylinder";
import { sizingContext } from "~/hydraulics/evaluate";
import { holdingFor } from "~/hydraulics/holding";
import { hydraulicPowerKw, selectMotorKw } from "~/hydraulics/pump-motor";
import { brakingLoadPressureBar, cbvSettingBar } from "~/hydraulics/valves";
import { REFERENCE_PRESS } from "../../support/hydraulics";

const G = 9.80665; // standard gravity (CGPM 1901)
const ETA_O = 0.85; // overall pump efficiency, Esposito, from memory [M]
/** value in the trail, for steps whose input the design does not carry as a field */
const trailValue = (d: Design, quantity: string): number => {
  const e = d.trail.find((t) => t.quantity === quantity);
  if (!e || typeof e.value !== "number") throw new Error(`no numeric trail entry "${quantity}"`);
  return e.value;
};
const roundUp5 = (bar: number) => Math.ceil(bar / 5 - 1e-9) * 5; // relief and settings rounded up to 5 bar, our convention

// ---------------------------------------------------------------------------------------------
// The shared sources' two-speed reference axis: 100 kN pressing at the end of a 400 mm stroke,
// approach 0.2 m/s, pressing 0.01 m/s (here over the last 20 mm), a 10 s dwell, 60 cycles/h.
// Horizontal, 500 kg on guides with μ = 0.1 (the default, common practice).
// ---------------------------------------------------------------------------------------------
const PRESS: RequirementsInput = { ...REFERENCE_PRESS, dwellS: 10, mountingStyle: "front-flange" };
const A1 = (Math.PI * 100 ** 2) / 4; // 7853.98 mm², circle area [D]
const Q_PRESS = (A1 * 10 * 0.06) / 1000; // 4.712 L/min, continuity Q = A·v [D]; shared check value 4.71
// Pump for the approach: 94.25 L/min needs 1000·94.25/(1450·0.95) = 68.4 cm³/rev → 80 cm³/rev
// (ISO 3662 R10 [M]), delivering 80·1450·0.95/1000 = 110.2 L/min (Q = V·n·η_v, Esposito [M]).
const Q_P = (80 * 1450 * 0.95) / 1000;
// Pressing force F = 100 000 + 0.1·500·g = 100 490.3 N (statics [D]); the work the rod does while
// pressing is F·v = 100 490.3 N · 0.01 m/s = 1.005 kW [D].
const PRESS_WORK_KW = ((100_000 + 0.1 * 500 * G) * 10) / 1e6;

describe("two-speed press with a fixed pump: a meter-in flow control, the surplus over the relief", () => {
  const d = sizeCircuit({ ...PRESS, pumpType: "fixed" });
  const relief = d.pressuresBar.reliefSetting;
  const pPress = d.pressuresBar.press!;

  it("sizes the axis as the reference: 100 mm bore, 110.2 L/min, relief 150 bar", () => {
    expect(d.cylinder.boreMm).toBe(100);
    expect(d.flowsLpm.pump).toBeCloseTo(Q_P, 9);
    // pressing pressure 10·100 490.3/(0.95·7853.98) = 134.68 bar at the cylinder (force balance,
    // η_cm 0.95 common practice [CP]), + 0.03 bar of line and valve loss at 4.7 L/min (engine)
    expect(pPress).toBeCloseTo(134.68, 1);
    // relief 1.1 × 134.71 = 148.2 → 150 bar (about 10 % above the working pressure, common practice [CP])
    expect(relief).toBe(150);
  });

  it("sets the pressing speed with a flow control at 4.71 L/min, bypassed in the approach (common practice)", () => {
    const pc = d.pressSpeedControl!;
    expect(pc).not.toBeNull();
    // the fixed pump offers 110.2 L/min while pressing, 23 × the 4.712 L/min asked: it cannot press slowly on its own
    expect(pc.pumpOffersLpm).toBeCloseTo(Q_P, 9);
    expect(pc.settingLpm).toBeCloseTo(Q_PRESS, 9);
    // surplus over the relief: 110.2 − 4.712 = 105.49 L/min (continuity [D])
    expect(pc.overReliefLpm).toBeCloseTo(Q_P - Q_PRESS, 9);
    // drop left to regulate: 150 − 134.71 = 15.3 bar, above the ~5 bar a compensated flow control needs (from memory [M])
    expect(pc.availableDropBar).toBeCloseTo(relief - pPress, 9);
    expect(pc.availableDropBar).toBeGreaterThan(pc.minDropBar);
    // the bypass fails slow: normally closed, dropped by a limit switch (common practice)
    expect(pc.bypass).toMatch(/normally closed/);
    // the bypass carries the approach flow, the control's check the return φ·Q_p from the cap end (continuity [D])
    expect(pc.bypassFlowLpm).toBeCloseTo(Q_P, 9);
    expect(pc.returnFlowLpm).toBeCloseTo(Q_P * d.cylinder.areaRatio, 9);
    const keys = d.bom.map((l) => l.key);
    expect(keys).toEqual(expect.arrayContaining(["press-flow-control", "press-bypass-valve", "press-limit-switch"]));
    expect(d.bom.find((l) => l.key === "press-flow-control")!.specification).toMatch(/4\.71 L\/min/);
    expect(d.trail.some((t) => t.quantity === "pressing-speed flow control setting")).toBe(true);
  });

  it("turns the relief surplus and the control's drop into heat: 31.41 kW while pressing (energy balance)", () => {
    // input power at the relief: 150 · 110.2 / 600 / 0.85 = 32.412 kW (P = p·Q/600 [D]; fixed pump sits
    // at the relief while pressing slower than it delivers, trade-press pump articles [S])
    const inputKw = hydraulicPowerKw(150, Q_P) / ETA_O;
    expect(inputKw).toBeCloseTo(32.412, 3);
    // heat = input − work on the process force = 32.412 − 1.005 = 31.407 kW [D]
    expect(d.heat.pressLossKw).toBeCloseTo(inputKw - PRESS_WORK_KW, 6);
    // and the same heat place by place [D]: over the relief 150·105.49/600 = 26.37 kW; across the flow
    // control (150 − 134.71)·4.712/600 = 0.120 kW; in the pump (1 − 0.85)·input = 4.86 kW; in the
    // cylinder's seals and lines p_press·Q_press/600 − F·v = 0.053 kW. 6 decimals: only rounding.
    const places =
      hydraulicPowerKw(150, Q_P - Q_PRESS) +
      hydraulicPowerKw(150 - pPress, Q_PRESS) +
      (1 - ETA_O) * inputKw +
      (hydraulicPowerKw(pPress, Q_PRESS) - PRESS_WORK_KW);
    expect(places).toBeCloseTo(31.407, 2);
    expect(d.heat.pressLossKw).toBeCloseTo(places, 6);
    // in the dwell the rod does no work: all 32.41 kW is heat (shared check value 22.0 kW hydraulic at 94.25 L/min and 140 bar)
    expect(d.heat.dwellLossKw).toBeCloseTo(inputKw, 6);
  });

  it("gives the motor for the peak at the relief: 32.41 kW / 1.5 → 22 kW (IEC 60034-1 overload [M], IEC 60072-1)", () => {
    expect(d.motor.peakKw).toBeCloseTo(32.412, 3);
    // short peaks (2 s pressing + 10 s dwell, each ≤ 15 s) may reach 1.5 × the rating: 32.41/1.5 = 21.61 kW
    expect(d.motor.rmsKw!).toBeLessThan(32.412 / 1.5);
    expect(d.motor.ratedKw).toBe(selectMotorKw(32.412 / 1.5).ratedKw);
    expect(d.motor.ratedKw).toBe(22);
    // decompression from the relief the pump sits at (definition of the bulk modulus [D])
    expect(d.decompression.pressureBar).toBe(150);
  });
});

describe("two-speed press with a double pump: the small section is too fast, so it needs the control too", () => {
  const d = sizeCircuit({ ...PRESS, pumpType: "double" });
  // small section for 4.712 L/min: 1000·4.712/(1450·0.95) = 3.42 cm³/rev → 4 cm³/rev (ISO 3662 [M]), 5.51 L/min,
  // 17 % fast: a flow control is fitted anyway, so it may grow up to two sizes (our convention). The large section
  // takes the rest of the 94.25 L/min approach (68.42 cm³/rev): 4 + 80 = 84, 5 + 80 = 85, 6.3 + 63 = 69.3 cm³/rev;
  // the smallest pair: Q_S = 6.3·1.3775 = 8.678 L/min, Q_L = 63·1.3775 = 86.78 L/min (Q = V·n·η_v [M])
  const Q_S = (6.3 * 1450 * 0.95) / 1000;
  const Q_L = (63 * 1450 * 0.95) / 1000;

  it("has sections of 63 and 6.3 cm³/rev and unloads above the fast-motion pressure (common practice)", () => {
    expect(d.pump.displacementsCcRev).toEqual([63, 6.3]);
    // both sections together: 69.3 cm³/rev, 95.46 L/min, the approach's and return's flow
    expect(d.flowsLpm.pump).toBeCloseTo(Q_S + Q_L, 9);
    // p_u = max(1.15·p_fast, p_fast + 10), rounded up to 5 bar, p_fast the higher of approach and return (engine's
    // pressures with line losses); it must stay below 0.8 × 134.7 = 107.8 bar (our convention)
    const pFast = Math.max(d.pressuresBar.approach!, d.pressuresBar.retract);
    expect(d.pump.unloadingBar).toBe(roundUp5(Math.max(1.15 * pFast, pFast + 10)));
    expect(d.pump.unloadingBar!).toBeLessThanOrEqual(0.8 * d.pressuresBar.press!);
  });

  it("fits the flow control: 8.68 L/min is more than 10 % above 4.71 (speed tolerance, our convention)", () => {
    // 8.678 / 4.712 = 1.842 > 1.1 → the control sets 4.712 and 3.966 L/min crosses the relief [D]
    expect(Q_S / Q_PRESS).toBeCloseTo(1.842, 3);
    const pc = d.pressSpeedControl!;
    expect(pc.pumpOffersLpm).toBeCloseTo(Q_S, 9);
    expect(pc.overReliefLpm).toBeCloseTo(Q_S - Q_PRESS, 9);
  });

  it("loses 3.40 kW pressing and dwelling, against 32.41 kW for the fixed pump (shared sources: high-low pump)", () => {
    // small section over the 150 bar relief, large section dumped at 5 bar: (150·8.678 + 5·86.78)/600 = 2.893 kW
    // hydraulic, /0.85 = 3.403 kW shaft, all heat in the dwell (P = p·Q/600 [D]; Δp_u 5 bar [CP])
    const shaft = (hydraulicPowerKw(150, Q_S) + hydraulicPowerKw(5, Q_L)) / ETA_O;
    expect(shaft).toBeCloseTo(3.403, 3);
    expect(d.heat.dwellLossKw).toBeCloseTo(shaft, 6);
    // pressing: the same less the work on the process force, 3.403 − 1.005 = 2.398 kW [D]
    expect(d.heat.pressLossKw).toBeCloseTo(shaft - PRESS_WORK_KW, 6);
  });

  it("sizes the motor on both sections just before unloading: 5.62 kW peak → 4 kW (IEC 60034-1 [M], IEC 60072-1)", () => {
    // p_u · (Q_S + Q_L) / 600 / 0.85 = 30 · 95.46 / 510 = 5.615 kW (shared sources: the peak comes just before
    // unloading); the cycle is short, so up to 1.5 × the rating: 5.615 / 1.5 = 3.74 kW → 4 kW
    const peak = (d.pump.unloadingBar! * (Q_S + Q_L)) / 600 / ETA_O;
    expect(d.pump.unloadingBar).toBe(30);
    expect(peak).toBeCloseTo(5.615, 3);
    expect(d.motor.peakKw).toBeCloseTo(peak, 9);
    expect(d.motor.ratedKw).toBe(4);
    expect(d.motor.rmsKw!).toBeLessThan(peak / 1.5);
    expect(d.motor.ratedKw).toBe(selectMotorKw(peak / 1.5).ratedKw);
  });

  it("a small section within 10 % presses without a control, at the pressing pressure, not over the relief", () => {
    // 11 mm/s: Q_press = 7853.98·11·0.06/1000 = 5.184 L/min → 3.76 cm³/rev → 4 cm³/rev, 5.51 L/min: 6.3 % fast, within 10 %,
    // so it stays at its fit; the large section 68.42 − 4 = 64.42 → 80 cm³/rev, 110.2 L/min (ISO 3662 [M]; Q = V·n·η_v [M])
    const slowPress = sizeCircuit({ ...PRESS, pressSpeedMmS: 11, pumpType: "double" });
    expect(slowPress.pump.displacementsCcRev).toEqual([80, 4]);
    const [qL, qS] = [(80 * 1450 * 0.95) / 1000, (4 * 1450 * 0.95) / 1000];
    expect(slowPress.pressSpeedControl).toBeNull();
    expect(slowPress.bom.some((l) => l.key === "press-flow-control")).toBe(false);
    // pressing power: small section at p_press, large one dumped: (p_press·5.51 + 5·110.2)/600/0.85 [D]
    const pressKw = slowPress.motor.phases.find((p) => p.name === "pressing")!.kw;
    expect(pressKw).toBeCloseTo((hydraulicPowerKw(slowPress.pressuresBar.press!, qS) + hydraulicPowerKw(5, qL)) / ETA_O, 9);
    expect(slowPress.trail.find((t) => t.quantity === "pressing-speed control")!.value).toMatch(/small pump section/);
  });
});

describe("two-speed press with a pressure-compensated pump: destrokes while pressing, standby at rest", () => {
  const d = sizeCircuit({ ...PRESS, pumpType: "compensated" });
  const pPress = d.pressuresBar.press!;
  // standby leakage ≈ (1 − η_v)·Q_max = 0.05 · 110.2 = 5.51 L/min (shared sources' first estimate, from memory [M])
  const Q_LEAK = 0.05 * Q_P;

  it("standby loss is p_c·Q_leak/600: the shared sources' check value 140 bar × 4.71 L/min = 1.10 kW", () => {
    // the check value itself, on the reference pump of 94.25 L/min (compensated-pump section of the shared sources)
    expect(hydraulicPowerKw(140, 0.05 * 94.25)).toBeCloseTo(1.1, 2);
  });

  it("sets the compensator to leave the flow control its drop, 10 bar under the relief (trade-press article [S]; maker's page [CP])", () => {
    // p_c = max(roundUp5(134.71) = 135, min(roundUp5(134.71 + 5) = 140, floor5(150 − 10) = 140)) = 140 bar
    expect(d.pump.compensatorBar).toBe(140);
    expect(d.pressuresBar.reliefSetting - d.pump.compensatorBar!).toBeGreaterThanOrEqual(10);
    const pc = d.pressSpeedControl!;
    // drop across the control: 140 − 134.71 = 5.29 bar ≥ 5 bar (from memory [M]); nothing crosses the relief
    expect(pc.availableDropBar).toBeCloseTo(140 - pPress, 9);
    expect(pc.availableDropBar).toBeGreaterThanOrEqual(pc.minDropBar);
    expect(pc.overReliefLpm).toBe(0);
    expect(d.warnings.some((w) => w.code === "PRESS_CONTROL_DROP_LOW")).toBe(false);
  });

  it("sits at p_c with P blocked in neutral, no vent valve: 140 · 5.51 / 600 = 1.286 kW, the same in the dwell", () => {
    expect(d.directionalValve.center).toBe("closed");
    expect(d.reliefVent).toBeNull();
    expect(d.bom.some((l) => l.key === "relief-vent-valve")).toBe(false);
    expect(d.heat.neutralPressureBar).toBe(140);
    // P = p_c·Q_leak/600 = 140 · 5.510 / 600 = 1.2857 kW (shared sources' standby formula [D]; friction not counted)
    expect(d.heat.neutralLossKw).toBeCloseTo(1.2857, 4);
    expect(d.heat.dwellLossKw).toBeCloseTo(hydraulicPowerKw(140, Q_LEAK), 9);
    // against 32.41 kW for the fixed pump over its relief in the dwell: 31.1 kW less heat for 10 s of every 60 s,
    // 5.19 kW on average (the shared sources' quantified saving Σ (p_RV·Q_p/η − p_c·Q_leak)·t_dwell / T) [D]
    const fixed = sizeCircuit({ ...PRESS, pumpType: "fixed" });
    expect((fixed.heat.dwellLossKw - d.heat.dwellLossKw) * (10 / 60)).toBeCloseTo(5.188, 2);
  });

  it("destrokes to the pressing flow at p_c while pressing: 140 · 4.712 / 600 / 0.85 − 1.005 = 0.289 kW of heat", () => {
    const pressShaft = hydraulicPowerKw(140, Q_PRESS) / ETA_O; // 1.2935 kW (P = p·Q/600 [D])
    expect(d.motor.phases.find((p) => p.name === "pressing")!.kw).toBeCloseTo(pressShaft, 9);
    expect(d.heat.pressLossKw).toBeCloseTo(pressShaft - PRESS_WORK_KW, 6);
    // decompression from the compensator setting the cap end holds at the end of the stroke (bulk modulus [D])
    expect(d.decompression.pressureBar).toBe(140);
  });

  it("keeps the motor off the corner with a power limiter: the corner 140 · 110.2 / 600 = 25.7 kW is never drawn", () => {
    // the highest phase: approach or return at full flow, p·110.2/600 (trade-press pump chapters on power limiters [S])
    const highest = (Math.max(d.pressuresBar.approach!, d.pressuresBar.retract) * Q_P) / 600;
    expect(d.pump.powerLimitKw!).toBeCloseTo(highest / ETA_O, 6);
    expect(d.motor.peakKw).toBeLessThan(hydraulicPowerKw(140, Q_P) / ETA_O);
  });
});

// ---------------------------------------------------------------------------------------------
// A clamp held for an hour: leak-tight holding with pilot-operated checks (shared sources on
// holding a load without drift: spool valves leak, poppets do not; pilot ratio and opening).
// ---------------------------------------------------------------------------------------------
describe("a clamp held for an hour gets a pilot-operated check on the cap end", () => {
  const CLAMP: RequirementsInput = {
    orientation: "horizontal",
    massKg: 50,
    processForceN: 50_000,
    strokeMm: 100,
    extendSpeedMmS: 50,
    retractSpeedMmS: 50,
    mounting: "fixed-fixed",
    mountingStyle: "front-flange",
    cyclesPerHour: 20,
    hoursPerDay: 8,
    supplyHz: 50,
  };
  const held = sizeCircuit({ ...CLAMP, holdMinutes: 60 });

  it("the shared sources' check values for the pilot opening on 100/70 (force balance on the poppet [D])", () => {
    const cyl = cylinderCandidates().find((c) => c.boreMm === 100 && c.rodMm === 70)!;
    // 100/70: A1 = 7853.98, A3 = 4005.53 mm², φ = 1.961 (circle areas [D])
    expect(cyl.areaRatio).toBeCloseTo(1.961, 3);
    // cap side, 20 kN clamp, R = 4: p3 = (10·20 000/7853.98)/(4 − 1/1.961) = 25.46/3.490 = 7.30 bar (shared check value)
    const clampCtx = sizingContext(parseRequirements({ ...CLAMP, processForceN: 20_000, holdMinutes: 60 }));
    const cap = holdingFor(clampCtx.req, clampCtx.loads, cyl, 50)!;
    expect(cap.side).toBe("cap");
    expect(cap.pilotRatio).toBe(4);
    expect(cap.pilotOpeningBar).toBeCloseTo(7.3, 2);
    // rod side, 20 kN hanging (2039.4 kg), R = 4: p1 = (10·20 000/4005.53)/(4 − 1.961) = 49.93/2.039 = 24.5 bar,
    // p2 = 49.93 + 1.961·24.5 = 97.9 bar (shared check values; the valve needs R > φ to open at all)
    const hangCtx = sizingContext(
      parseRequirements({
        ...CLAMP,
        orientation: "vertical",
        rodDirection: "down",
        massKg: 20_000 / G,
        processForceN: 0,
        holdMinutes: 60,
      }),
    );
    const rod = holdingFor(hangCtx.req, hangCtx.loads, cyl, 50)!;
    expect(rod.side).toBe("rod");
    expect(rod.pilotOpeningBar).toBeCloseTo(24.5, 1);
    expect(rod.openingLoadSideBar).toBeCloseTo(97.9, 1);
  });

  it("on the engine's clamp: p3 = (F/A1)/(R − 1/φ) on the cylinder it chose, a float centre and a bill line", () => {
    const c = held.cylinder;
    const h = held.holding!;
    expect(h.kind).toBe("pilot-operated-check");
    expect(h.side).toBe("cap");
    // 50 kN on the chosen cap area; R = 4 (offered 3:1 to 4.4:1, makers [CP]; a 2:1 cylinder needs ≥ 3:1 [S])
    const loadBar = (10 * 50_000) / c.capAreaMm2;
    expect(h.openingLoadSideBar).toBeCloseTo(loadBar, 9);
    expect(h.pilotOpeningBar).toBeCloseTo(loadBar / (4 - 1 / c.areaRatio), 9);
    // the pilot must vent in neutral so the poppet seats: A and B to T (common practice [CP])
    expect(held.directionalValve.center).toBe("float");
    const line = held.bom.find((l) => l.key === "holding-valve")!;
    expect(line.specification).toMatch(/pilot ratio 4:1/);
  });

  it("a hold of 5 min or less needs no leak-tight holding (our reading of 'more than a few minutes' [CP])", () => {
    expect(sizeCircuit({ ...CLAMP, holdMinutes: 5 }).holding).toBeNull();
    expect(sizeCircuit({ ...CLAMP, holdMinutes: 5.01 }).holding).not.toBeNull();
  });
});

// ---------------------------------------------------------------------------------------------
// A load lowered fast: 2 t hanging from the rod, lowered at 600 mm/s asked, stopped in 0.1 s.
// The counterbalance setting must cover the braking (shared sources on the CBV setting with braking).
// ---------------------------------------------------------------------------------------------
describe("a 2 t load lowered fast: the counterbalance setting covers braking; piston speed and cushions", () => {
  it("the shared sources' check value: 2000 kg lowered at 1.0 m/s, stopped in 0.2 s, on 100/70 → p_set 96.1 bar", () => {
    // p_L,max = 10·(m·g + m·v/t)/A3 = 10·(19 613 + 10 000)/4005.53 = 73.93 bar (Newton's second law [D]);
    // the source gives 73.95 with g rounded to 9.81 (0.02 bar: the tolerance absorbs it)
    const a3 = (Math.PI * (100 ** 2 - 70 ** 2)) / 4;
    const braking = brakingLoadPressureBar(2000 * G, 2000, 1000, 0.2, a3);
    expect(braking).toBeCloseTo(73.95, 1);
    // p_set = 1.3 · 73.95 = 96.1 bar (1.3 × load pressure, valve makers' notes [CP]); the static 1.3·48.98 = 63.7 bar
    // would relieve while braking and let the load run on
    expect(cbvSettingBar(braking)).toBeCloseTo(96.1, 0);
    expect(cbvSettingBar((10 * 2000 * G) / a3)).toBeLessThan(braking);
  });

  const d = sizeCircuit({
    orientation: "vertical",
    rodDirection: "down",
    massKg: 2000,
    strokeMm: 800,
    extendSpeedMmS: 600,
    retractSpeedMmS: 200,
    accelTimeS: 0.3,
    decelTimeS: 0.1,
    mounting: "fixed-pinned",
    mountingStyle: "front-flange",
    cyclesPerHour: 30,
    hoursPerDay: 8,
    supplyHz: 50,
  });
  const c = d.cylinder;
  const W = 2000 * G; // 19 613.3 N, weight (statics [D])

  it("lowers at the speed the pump gives, 731 mm/s, not the 600 asked (continuity [D])", () => {
    // 80/36: A1 = 5026.55 mm²; the larger stroke flow 5026.55·600·0.06/1000 = 180.96 L/min → 131.4 cm³/rev
    // → 160 cm³/rev (ISO 3662 [M]) → 220.4 L/min; lowering at 220.4·1000/(5026.55·0.06) = 730.8 mm/s
    expect([c.boreMm, c.rodMm]).toEqual([80, 36]);
    expect(d.flowsLpm.pump).toBeCloseTo((160 * 1450 * 0.95) / 1000, 9);
    expect(d.speedsMmS.extendActual).toBeCloseTo((220.4 * 1000) / (c.capAreaMm2 * 0.06), 9);
    expect(d.speedsMmS.extendActual).toBeCloseTo(730.8, 1);
  });

  it("sets the rod-side valve for the load braked from 731 mm/s in 0.1 s: 85.4 bar → 111.0 bar", () => {
    const cb = d.counterbalance!;
    expect(cb.side).toBe("rod");
    // static p_L = 10·19 613.3/4008.67 = 48.93 bar on the annulus (80/36: A3 = 5026.55 − 1017.88 mm²) [D]
    expect(cb.loadPressureBar).toBeCloseTo((10 * W) / c.annulusAreaMm2, 9);
    expect(cb.loadPressureBar).toBeCloseTo(48.93, 2);
    // braking: 10·(19 613.3 + 2000·0.7308/0.1)/4008.67 = 10·34 229/4008.67 = 85.39 bar (Newton [D])
    const braking = (10 * (W + (2000 * d.speedsMmS.extendActual) / 1000 / 0.1)) / c.annulusAreaMm2;
    expect(cb.brakingPressureBar).toBeCloseTo(braking, 9);
    expect(cb.brakingPressureBar).toBeCloseTo(85.39, 2);
    // p_set = 1.3 · 85.39 = 111.0 bar (valve makers' notes [CP]), within the 160 bar rating of the rod side
    expect(cb.settingBar).toBeCloseTo(1.3 * braking, 9);
    expect(cb.settingBar).toBeCloseTo(111.0, 1);
    expect(cb.settingBar).toBeLessThanOrEqual(c.ratedPressureBar);
    // pilot opening (p_set − p_L)/(R + φ) = (111.0 − 48.93)/(4.5 + 1.2539) = 10.79 bar (force balance [D]; 4.5:1 general [CP])
    expect(cb.pilotOpeningBar).toBeCloseTo((cb.settingBar - cb.loadPressureBar) / (cb.pilotRatio + c.areaRatio), 9);
    expect(cb.pilotOpeningBar).toBeCloseTo(10.79, 2);
  });

  it("cushions both ends and warns of the 916 mm/s return (about 0.1 m/s and 0.5 m/s, common practice and memory)", () => {
    // return: 220.4 L/min on the annulus, 220.4·1000/(4008.67·0.06) = 916.3 mm/s > 500 mm/s [M] → warning
    expect(d.speedsMmS.retractActual).toBeCloseTo(916.3, 1);
    expect(d.warnings.some((w) => w.code === "PISTON_SPEED_HIGH")).toBe(true);
    const e = c.cushioning.extend;
    expect(e.cushioned).toBe(true);
    // extended end, load moving down into it: E = ½·2000·0.7308² = 534.05 J; F = 534.05/0.025 + 19 613.3 = 40 975 N;
    // p = 10·40 975/4008.67 = 102.2 bar on the rod side (kinetic energy, force balance [D]; 25 mm cushion [CP])
    expect(e.energyJ).toBeCloseTo(0.5 * 2000 * (d.speedsMmS.extendActual / 1000) ** 2, 9);
    expect(e.energyJ).toBeCloseTo(534.05, 1);
    expect(e.cushionBar).toBeCloseTo((10 * (e.energyJ / 0.025 + W)) / c.annulusAreaMm2, 9);
    expect(e.cushionBar).toBeCloseTo(102.2, 1);
    // plus what is still driven in, φ·p1 with p1 the cap pressure while lowering (trail) [D]
    expect(e.peakBar).toBeCloseTo(e.cushionBar + c.areaRatio * trailValue(d, "extend pressure at the cylinder"), 9);
    // retracted end, lifting into it: E = ½·2000·0.9163² = 839.7 J on the cap area, no weight added (it moves up)
    const r = c.cushioning.retract;
    expect(r.cushionBar).toBeCloseTo((10 * (0.5 * 2000 * 0.9163466 ** 2)) / 0.025 / c.capAreaMm2, 3);
    expect(Math.max(e.peakBar, r.peakBar)).toBeLessThanOrEqual(c.ratedPressureBar);
    expect(d.warnings.some((w) => w.code === "CUSHION_PRESSURE_HIGH")).toBe(false);
  });
});
