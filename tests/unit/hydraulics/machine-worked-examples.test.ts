/**
 * Two machines worked by hand. The axes' own cylinders, pressures and speeds come from the axis
 * sizing, which its own worked examples check (worked-examples*.test.ts); here each step of the
 * power unit over the machine cycle is worked from those figures with the rule and source named.
 * Series: ISO 3320 cylinder areas, ISO 3662 displacements, IEC 60072-1 motor ratings.
 */
import { describe, expect, it } from "vitest";
import { sizeMachine, type MachineDesign } from "~/hydraulics";
import { choosePump } from "~/hydraulics/pump-choice";
import { pumpInPhase, type MachinePump } from "~/hydraulics/machine-pump";
import type { TimelinePhase } from "~/hydraulics/machine-timeline";
import { CLAMP, FEED, PRESS } from "../../support/machines";

const DUTY = { cyclesPerHour: 120, hoursPerDay: 16, supplyHz: 50, maxPressureBar: 160 } as const;
const step = (...moves: [string, "extend" | "retract"][]) => moves.map(([axis, motion]) => ({ axis, motion }));

// Continuity, fluid-power textbooks: Q [L/min] = A [mm²] · v [mm/s] · 0.06 / 1000.
const lpm = (areaMm2: number, mmS: number) => (areaMm2 * mmS * 0.06) / 1000;
const circle = (dMm: number) => (Math.PI * dMm ** 2) / 4;
const axis = (m: MachineDesign, name: string) => m.axes.find((a) => a.name === name)!;

describe("worked example 1: a clamp, then a press stroke, in sequence", () => {
  // Clamp closes, the press makes its stroke (approach, 20 mm pressing at 10 mm/s) and returns,
  // then the clamp opens: one axis at a time, 120 cycles an hour on 50 Hz.
  const m = sizeMachine({
    axes: [CLAMP, PRESS],
    ...DUTY,
    sequence: [step(["Clamp", "extend"]), step(["Press", "extend"]), step(["Press", "retract"]), step(["Clamp", "retract"])],
  });

  it("keeps each axis's own cylinder (ISO 3320 areas)", () => {
    // Clamp 32/14: A1 = π·32²/4 = 804.25 mm², A3 = A1 − π·14²/4 = 650.31 mm².
    expect(axis(m, "Clamp").cylinder).toMatchObject({ boreMm: 32, rodMm: 14 });
    expect(axis(m, "Clamp").cylinder.annulusAreaMm2).toBeCloseTo(circle(32) - circle(14), 6);
    // Press 100/45: A1 = 7 853.98 mm², A3 = 6 263.55 mm².
    expect(axis(m, "Press").cylinder).toMatchObject({ boreMm: 100, rodMm: 45 });
  });

  it("sizes the pump for the largest single flow: in a pure sequence only one axis draws at a time", () => {
    // Flows at the asked speeds (continuity): clamp out 804.25·50 → 2.41, press approach
    // 7 853.98·100 → 47.12, press return 6 263.55·150 → 56.37, clamp back 650.31·100 → 3.90 L/min.
    const press = { approach: lpm(circle(100), 100), back: lpm(circle(100) - circle(45), 150) };
    expect(press.approach).toBeCloseTo(47.12, 2);
    expect(press.back).toBeCloseTo(56.37, 2);
    // Several actuators on one pump: Q_p ≥ max over the steps of ΣQ_i = 56.37 L/min.
    expect(m.flowsLpm.requiredMax).toBeCloseTo(56.37, 2);
    // V_g = 1000·Q / (n·η_v) = 1000·56.37 / (1450·0.95) = 40.92 cm³/rev → next in ISO 3662: 50.
    expect(m.pump.requiredDisplacementCcRev).toBeCloseTo(40.92, 2);
    expect(m.pump.displacementCcRev).toBe(50);
    // Q = V_g·n·η_v / 1000 = 50·1450·0.95 / 1000 = 68.875 L/min.
    expect(m.flowsLpm.pump).toBeCloseTo(68.875, 6);
  });

  it("chooses a compensated pump, since the clamp alone draws far less than the pump delivers", () => {
    // A fixed pump would push 68.9 − 4.3 L/min over the relief while the clamp moves (common practice: compensated pump for unequal branches).
    expect(m.pump.type).toBe("compensated");
    // Compensator: the highest working pressure (press, 134.75 bar) rounded up to 5 bar, and at least the pressing
    // pressure plus the meter-in control's 5 bar: ⌈139.75 / 5⌉·5 = 140 bar (trade-press pump practice [CP]).
    expect(m.pressuresBar.workingMax).toBeCloseTo(134.75, 2);
    expect(m.pump.compensatorBar).toBe(140);
    // Relief above it: max(1.1·140, 140 + 10) = 154 → 155 bar (p_c + 10…20 bar, common practice).
    expect(m.pressuresBar.reliefSetting).toBe(155);
  });

  it("lays out the cycle phase by phase with the pump's pressure, delivery and power", () => {
    const phases = m.cycle.map((p) => [p.step, p.phase, p.axes.join("+")]);
    expect(phases).toEqual([
      [0, "extend", "Clamp"],
      [1, "approach", "Press"],
      [1, "pressing", "Press"],
      [2, "retract", "Press"],
      [3, "retract", "Clamp"],
      [null, "neutral", ""],
    ]);
    const [clampOut, approach, pressing, back] = m.cycle;
    // The clamp moves alone at the speed its own pump gives it (89.92 mm/s): t = s / v = 50 / 89.92 = 0.556 s;
    // it draws 804.25·89.92 → 4.34 L/min and the compensated pump destrokes to that at p_c = 140 bar.
    expect(clampOut.durationS).toBeCloseTo(50 / axis(m, "Clamp").speedsMmS.extendActual, 9);
    expect(clampOut.durationS).toBeCloseTo(0.556, 3);
    expect(clampOut).toMatchObject({ pressureBar: 140 });
    expect(clampOut.pumpFlowLpm).toBeCloseTo(4.34, 2);
    // P = p·Q / 600 = 140 · 4.339 / 600 = 1.012 kW.
    expect(clampOut.hydraulicKw).toBeCloseTo(1.012, 3);
    // Press approach: the whole 68.875 L/min at the 15.97 bar the approach needs; t = 180 / 146.16 = 1.232 s;
    // P = 15.97 · 68.875 / 600 = 1.834 kW.
    expect(approach.pumpFlowLpm).toBeCloseTo(68.875, 6);
    expect(approach.pressureBar).toBeCloseTo(15.97, 2);
    expect(approach.durationS).toBeCloseTo(1.232, 3);
    expect(approach.hydraulicKw).toBeCloseTo(1.834, 3);
    // Pressing: 20 mm at 10 mm/s = 2.0 s; 7 853.98·10 → 4.71 L/min at p_c = 140 bar: 1.100 kW.
    expect(pressing.durationS).toBeCloseTo(2, 9);
    expect(pressing.demandLpm).toBeCloseTo(4.712, 3);
    expect(pressing.hydraulicKw).toBeCloseTo(1.1, 3);
    // Return: 200 / 183.27 = 1.091 s at 14.13 bar with the whole flow: 1.622 kW.
    expect(back.durationS).toBeCloseTo(1.091, 3);
    expect(back.hydraulicKw).toBeCloseTo(1.622, 3);
    // Neutral: the rest of 3600 / 120 = 30 s.
    const busy = m.cycle.slice(0, 5).reduce((s, p) => s + p.durationS, 0);
    expect(m.cycle[5].durationS).toBeCloseTo(30 - busy, 9);
  });

  it("sizes the motor from the highest phase power and the RMS over the short cycle", () => {
    // Highest phase: the approach, 1.834 / 0.85 = 2.157 kW shaft. The cycle (30 s) is under 5 min,
    // so RMS counts (motor-sizing practice for short duty cycles): required = max(P_rms, P_peak / 1.5)
    // = max(1.007, 1.438) = 1.438 kW → IEC 60072-1: 1.5 kW.
    expect(m.motor.peakKw).toBeCloseTo(1.834 / 0.85, 2);
    expect(m.motor.rmsKw!).toBeCloseTo(1.007, 3);
    expect(m.motor.requiredKw).toBeCloseTo(1.438, 3);
    expect(m.motor.ratedKw).toBe(1.5);
  });

  it("sizes the reservoir for the pump and the oil both cylinders draw", () => {
    // V = 4 × 68.875 + (153.94·50 + 1 590.43·200)/10⁶ = 275.50 + 0.326 = 275.83 L → 280 L (rounded up to 5 L;
    // 3–5 × pump flow per minute, common practice; the level drop from the rods [D]).
    expect(m.reservoir.cylinderDrawL).toBeCloseTo((circle(14) * 50 + circle(45) * 200) / 1e6, 9);
    expect(m.reservoir.volumeL).toBe(280);
  });
});

describe("worked example 2: a feed and two clamps, the clamps moving together", () => {
  // Both clamps close together, the feed runs out, both clamps open together, the feed returns.
  const m = sizeMachine({
    axes: [FEED, { ...CLAMP, name: "Clamp 1" }, { ...CLAMP, name: "Clamp 2" }],
    ...DUTY,
    sequence: [
      step(["Clamp 1", "extend"], ["Clamp 2", "extend"]),
      step(["Feed", "extend"]),
      step(["Clamp 1", "retract"], ["Clamp 2", "retract"]),
      step(["Feed", "retract"]),
    ],
  });

  it("adds the flows of the clamps moving together, each at its asked speed", () => {
    // Clamps out together: 2 × 804.25·50 → 2 × 2.413 = 4.825 L/min; back together: 2 × 650.31·100 → 7.804 L/min.
    expect(m.cycle[0].axes).toEqual(["Clamp 1", "Clamp 2"]);
    expect(m.cycle[0].demandLpm).toBeCloseTo(2 * lpm(circle(32), 50), 9);
    expect(m.cycle[0].demandLpm).toBeCloseTo(4.825, 3);
    const back = m.cycle.find((p) => p.step === 2)!;
    expect(back.demandLpm).toBeCloseTo(7.804, 3);
    // Together they run at the asked speed, so the stroke takes s / v = 50 / 50 = 1 s out and 50 / 100 = 0.5 s back.
    expect(m.cycle[0].durationS).toBeCloseTo(1, 9);
    expect(back.durationS).toBeCloseTo(0.5, 9);
  });

  it("sizes the pump for the largest sum: Q_p = max(ΣQ_clamps, Q_feed)", () => {
    // The feed 25/18 extends regeneratively: the pump fills only the rod's 254.47 mm², 254.47·200 → 3.05 L/min;
    // it returns on 236.40 mm² at 200 mm/s → 2.84 L/min. Q_p = max(4.825, 3.05, 7.804, 2.84) = 7.804 L/min.
    expect(axis(m, "Feed").cylinder).toMatchObject({ boreMm: 25, rodMm: 18 });
    expect(axis(m, "Feed").regenerative).toBe(true);
    expect(m.flowsLpm.requiredMax).toBeCloseTo(7.804, 3);
    // V_g = 1000·7.804 / (1450·0.95) = 5.665 → ISO 3662: 6.3 cm³/rev, 6.3·1450·0.95/1000 = 8.678 L/min.
    expect(m.pump.requiredDisplacementCcRev).toBeCloseTo(5.665, 3);
    expect(m.pump.displacementCcRev).toBe(6.3);
    expect(m.flowsLpm.pump).toBeCloseTo(8.678, 3);
  });

  it("gives the phase where the clamps close together its power at the compensator", () => {
    // The pump destrokes to the 4.825 L/min the clamps draw at p_c = 135 bar (132.17 bar working, rounded up to 5):
    // P = 135 · 4.825 / 600 = 1.086 kW (several actuators on one pump, P = p_p·ΣQ / 600).
    expect(m.pump.type).toBe("compensated");
    expect(m.pump.compensatorBar).toBe(135);
    expect(m.cycle[0].hydraulicKw).toBeCloseTo(1.086, 3);
  });

  it("keeps every valve's P blocked in neutral and vents nothing for a compensated pump", () => {
    // Parallel valves on one pump cannot have tandem or open centres (several-actuator practice, trade texts).
    for (const a of m.axes) expect(["closed", "float"]).toContain(a.directionalValve.center);
    expect(m.reliefVent).toBeNull();
    // Reservoir: 4 × 8.678 + (254.47·500 + 2 × 153.94·50)/10⁶ = 34.71 + 0.143 = 34.86 → 35 L.
    expect(m.reservoir.volumeL).toBe(35);
  });
});

describe("the check value of several actuators on one pump", () => {
  // Axis A 40 L/min at 120 bar and axis B 25 L/min at 60 bar move together on a fixed pump of 65 L/min:
  // the pump runs at the higher pressure, P_hyd = 120 × 65 / 600 = 13.0 kW (shared sources' check value, [D]).
  it("runs the pump at the highest pressure and the summed flow", () => {
    const choice = choosePump(
      {
        approachBar: 120,
        retractBar: 90,
        press: null,
        reliefBar: 135,
        workingBar: 120,
        ratedBar: 250,
        requiredDisplacementCc: 50,
        displacementCc: 50,
        pumpFlowLpm: 65,
        speedRpm: 1450,
      },
      "fixed",
    );
    const mp: MachinePump = {
      choice,
      demand: {} as MachinePump["demand"],
      requiredLpm: 65,
      requiredDisplacementCc: 47.2,
      inSeries: true,
      qpLpm: 65,
      speedRpm: 1450,
      smallLpm: null,
      governingAxis: "A",
    };
    const together: TimelinePhase = {
      step: 0,
      phase: "together",
      kind: "fast",
      durationS: 1,
      segments: [],
      axes: ["A", "B"],
      demandLpm: 65,
      sizingLpm: 65,
      needBar: 120,
      returnLpm: 0,
    };
    const phase = pumpInPhase(together, mp);
    expect(phase).toMatchObject({ bar: 120, lpm: 65 });
    expect(phase.kw).toBeCloseTo(13.0, 9);
    // Axis C alone, 30 L/min at 90 bar, on the same fixed pump: the surplus 35 L/min crosses the 135 bar relief.
    const alone = pumpInPhase({ ...together, axes: ["C"], demandLpm: 30, sizingLpm: 30, needBar: 90 }, mp);
    expect(alone).toMatchObject({ bar: 135, lpm: 65 });
  });
});
