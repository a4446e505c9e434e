/**
 * One cycle of the axis as phases in time order: what the cylinder draws from the pump, the
 * pump pressure, what the chosen pump delivers and the power it hands to the oil. It reads only
 * numbers the sizing has already reached (pressures, flows, the pump's sections and settings, the
 * motor's phase list), so the cycle chart shows the same figures the motor was sized from. The
 * entries have the shape of a machine cycle's phases (step, axes), so several axes can share it.
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import { phaseFlowLpm } from "./phases";
import { hydraulicPowerKw, pumpDeliveryLpm } from "./pump-motor";
import { v, type TrailEntry } from "./trail";

/** "extend" is the whole extension of an axis without a pressing stroke. */
export const CYCLE_PHASES = ["approach", "extend", "pressing", "dwell", "retract", "neutral"] as const;
export type CyclePhaseName = (typeof CYCLE_PHASES)[number];

export interface CyclePhase {
  phase: CyclePhaseName;
  /** index into the axis's motions: 0 the extension (approach, pressing, dwell), 1 the return; null in neutral */
  step: number | null;
  /** names of the axes moving (none in a dwell or in neutral) */
  axes: string[];
  /** how long the phase lasts in one cycle */
  durationS: number;
  /** width to draw it: a long idle time is shortened so the moving phases stay readable */
  shownS: number;
  /** cylinder flow drawn from the pump (A_rod·v on a regenerative approach) */
  demandLpm: number;
  /** pump pressure */
  pressureBar: number;
  /** what the chosen pump delivers; the surplus over the demand crosses the relief */
  pumpFlowLpm: number;
  /** pressure × pump flow / 600 */
  hydraulicKw: number;
  /** shaft power the motor gives the pump then (with a double pump, the unloaded section's loss included) */
  shaftKw: number;
}

/** The axis name the cycle lists, where the buyer gave none. */
export const UNNAMED_AXIS = "axis";

/**
 * The cycle of a sized design. Durations are the motor's phase times (t = s / v at the actual
 * speeds; the dwell as asked); the rest of 3600 / cyclesPerHour is neutral. No neutral phase
 * with no cycles per hour, or where the motion fills the cycle (the duty warning says so).
 */
export function cycleOf(d: Omit<Design, "cycle">): CyclePhase[] {
  const r = d.requirements;
  const c = d.cylinder;
  const qp = d.flowsLpm.pump;
  const axis = r.name ?? UNNAMED_AXIS;
  const motor = new Map(d.motor.phases.map((ph) => [ph.name, ph]));
  const timeOf = (name: string): number => motor.get(name)?.durationS ?? 0;
  const shaftOf = (name: string): number => motor.get(name)?.kw ?? 0;
  const atForceBar = d.pump.type === "compensated" ? d.pump.compensatorBar! : d.pressuresBar.reliefSetting;

  /** What the chosen pump delivers at a pump pressure, given what the cylinder draws. */
  const delivery = (bar: number, drawnLpm: number): number => {
    if (d.pump.type === "double" && bar >= d.pump.unloadingBar! - 1e-9) {
      // Above the unloading setting the large section dumps to tank: the small one alone feeds.
      return pumpDeliveryLpm(d.pump.displacementsCcRev[1], d.pump.speedRpm, d.pump.volumetricEfficiency);
    }
    if (d.pump.type === "compensated" && bar >= d.pump.compensatorBar! - 1e-9) {
      // At its setting the pump destrokes to what is drawn; at dead-head only its leakage
      // (≈ (1 − η_v)·Q_max, the estimate the pump choice uses [M]).
      return drawnLpm > 0 ? drawnLpm : A.compensatorLeakShare.value * qp;
    }
    return qp;
  };

  /**
   * A double pump's small section presses at the relief where a flow control sends its surplus
   * over it, or at the pressing pressure where it feeds the cap end directly. The pump choice
   * decided which; its power says so, P·η = p·Q_S/600 + Q_L·Δp_u/600, so the pressure is read
   * back from it rather than decided a second time here.
   */
  const doublePressBar = (): number | null => {
    if (d.pump.type !== "double") return null;
    const qS = pumpDeliveryLpm(d.pump.displacementsCcRev[1], d.pump.speedRpm, d.pump.volumetricEfficiency);
    const pumpKw = shaftOf("pressing") * d.pump.overallEfficiency - hydraulicPowerKw(d.pump.unloadedDropBar!, qp - qS);
    return (600 * pumpKw) / qS;
  };

  const phases: Omit<CyclePhase, "shownS">[] = [];
  const add = (phase: CyclePhaseName, step: number | null, moving: boolean, durationS: number, demandLpm: number, pressureBar: number, shaftKw: number) => {
    if (!(durationS > 0)) return;
    const pumpFlowLpm = delivery(pressureBar, demandLpm);
    phases.push({
      phase, step, axes: moving ? [axis] : [], durationS, demandLpm, pressureBar, pumpFlowLpm,
      hydraulicKw: hydraulicPowerKw(pressureBar, pumpFlowLpm), shaftKw,
    });
  };

  // The approach draws A·v at the actual speed; a regenerative one only A_rod·v from the pump (continuity).
  const approachAreaMm2 = d.regenerative ? c.capAreaMm2 - c.annulusAreaMm2 : c.capAreaMm2;
  const pressing = d.flowsLpm.press !== undefined;
  add(pressing ? "approach" : "extend", 0, true, timeOf("approach"), phaseFlowLpm(approachAreaMm2, d.speedsMmS.extendActual),
    d.pressuresBar.extendMoving, shaftOf("approach"));
  // Pressing slower than the pump delivers, and the dwell, hold the pump at its relief (or compensator) setting.
  if (pressing) add("pressing", 0, true, timeOf("pressing"), d.flowsLpm.press!, doublePressBar() ?? atForceBar, shaftOf("pressing"));
  add("dwell", 0, false, timeOf("dwell"), 0, atForceBar, shaftOf("dwell"));
  add("retract", 1, true, timeOf("retract"), phaseFlowLpm(c.annulusAreaMm2, d.speedsMmS.retractActual), d.pressuresBar.retract, shaftOf("retract"));

  const busyS = phases.reduce((sum, ph) => sum + ph.durationS, 0);
  const cycleS = 3600 / r.cyclesPerHour;
  // No cycles per hour (or so few the time overflows): no cycle time, so no idle phase to draw.
  if (Number.isFinite(cycleS)) {
    // Neutral: all the shaft power becomes heat, so the heat balance's figure is the motor's.
    add("neutral", null, false, cycleS - busyS, 0, d.heat.neutralPressureBar, d.heat.neutralLossKw);
  }
  // Idle time is drawn at most as long as the rest of the cycle.
  return phases.map((ph) => ({ ...ph, shownS: ph.phase === "neutral" ? Math.min(ph.durationS, busyS) : ph.durationS }));
}

/** The trail's note on the cycle: its length and the highest hydraulic power in it. */
export function cycleTrail(cycle: CyclePhase[], cyclesPerHour: number): TrailEntry {
  const top = cycle.reduce((a, b) => (b.hydraulicKw > a.hydraulicKw ? b : a));
  const totalS = cycle.reduce((sum, ph) => sum + ph.durationS, 0);
  return {
    quantity: "highest hydraulic power in the cycle",
    value: top.hydraulicKw,
    unit: "kW",
    formula: `P = p·Q_pump / 600 in each phase (${cycle.map((ph) => ph.phase).join(", ")}); here ${top.phase}`,
    inputs: {
      p: v(top.pressureBar, "bar"),
      Q_pump: v(top.pumpFlowLpm, "L/min"),
      "cycle time": v(cyclesPerHour > 0 ? 3600 / cyclesPerHour : "no cycles", "s"),
      "phases together": v(totalS, "s"),
    },
    source: "hydraulic power p·Q, fluid-power textbooks [D]; phase times t = s / v (continuity) [D]",
  };
}
