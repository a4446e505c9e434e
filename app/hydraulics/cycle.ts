/**
 * One cycle of the axis as phases in time order: what the cylinder draws from the pump, the
 * pump pressure, what the chosen pump delivers and the power it hands to the oil. It reads only
 * numbers the sizing has already reached: the pump choice's pressure and delivery in each phase
 * (pump-choice.ts, the one source of them), the motor's phase list and the flows the cylinder
 * draws, so the cycle chart shows the same figures the motor was sized from. The
 * entries have the shape of a machine cycle's phases (step, axes), so several axes can share it.
 */
import type { Design } from "./design";
import { phaseFlowLpm } from "./phases";
import type { PumpPhase, PumpPhaseName } from "./pump-choice";
import { hydraulicPowerKw } from "./pump-motor";
import { v, type TrailEntry } from "./trail";

/** "extend" is the whole extension of an axis without a pressing stroke. */
export const CYCLE_PHASES = ["approach", "extend", "pressing", "dwell", "retract", "neutral"] as const;
export type CyclePhaseName = (typeof CYCLE_PHASES)[number];

/** What each phase of a cycle reports, an axis's (CyclePhase) or a machine's (MachineCyclePhase). */
export interface CyclePhaseFigures {
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

export interface CyclePhase extends CyclePhaseFigures {
  phase: CyclePhaseName;
  /** index into the axis's motions: 0 the extension (approach, pressing, dwell), 1 the return; null in neutral */
  step: number | null;
}

/** The pump's pressure and delivery in each phase (PumpChoice.phases) and in neutral (pumpPhaseInNeutral). */
export type CyclePumpPhases = Record<Exclude<PumpPhaseName, "unloadingPeak">, PumpPhase | null> & { neutral: PumpPhase };

/** The axis name the cycle lists, where the buyer gave none. */
export const UNNAMED_AXIS = "axis";

/**
 * The cycle of a sized design. Durations are the motor's phase times (t = s / v at the actual
 * speeds; the dwell as asked); the rest of 3600 / cyclesPerHour is neutral. No neutral phase
 * with no cycles per hour, or where the motion fills the cycle (the duty warning says so).
 */
export function cycleOf(d: Omit<Design, "cycle">, pump: CyclePumpPhases): CyclePhase[] {
  const r = d.requirements;
  const c = d.cylinder;
  const axis = r.name ?? UNNAMED_AXIS;
  const motor = new Map(d.motor.phases.map((ph) => [ph.name, ph]));
  const timeOf = (name: string): number => motor.get(name)?.durationS ?? 0;
  const shaftOf = (name: string): number => motor.get(name)?.kw ?? 0;

  const phases: Omit<CyclePhase, "shownS">[] = [];
  const add = (phase: CyclePhaseName, step: number | null, moving: boolean, durationS: number, demandLpm: number, at: PumpPhase | null, shaftKw: number) => {
    if (!(durationS > 0)) return;
    if (!at) throw new Error(`cycleOf: the pump choice reports no ${phase} phase, yet the cycle has one`);
    const { bar: pressureBar, lpm: pumpFlowLpm } = at;
    phases.push({
      phase,
      step,
      axes: moving ? [axis] : [],
      durationS,
      demandLpm,
      pressureBar,
      pumpFlowLpm,
      hydraulicKw: hydraulicPowerKw(pressureBar, pumpFlowLpm),
      shaftKw,
    });
  };

  // The approach draws A·v at the actual speed; a regenerative one only A_rod·v from the pump (continuity).
  const approachAreaMm2 = d.regenerative ? c.capAreaMm2 - c.annulusAreaMm2 : c.capAreaMm2;
  const pressing = d.flowsLpm.press !== undefined;
  add(
    pressing ? "approach" : "extend",
    0,
    true,
    timeOf("approach"),
    phaseFlowLpm(approachAreaMm2, d.speedsMmS.extendActual),
    pump.approach,
    shaftOf("approach"),
  );
  if (pressing) add("pressing", 0, true, timeOf("pressing"), d.flowsLpm.press!, pump.press, shaftOf("pressing"));
  add("dwell", 0, false, timeOf("dwell"), 0, pump.dwell, shaftOf("dwell"));
  add("retract", 1, true, timeOf("retract"), phaseFlowLpm(c.annulusAreaMm2, d.speedsMmS.retractActual), pump.retract, shaftOf("retract"));

  const busyS = phases.reduce((sum, ph) => sum + ph.durationS, 0);
  const cycleS = 3600 / r.cyclesPerHour;
  // No cycles per hour (or so few the time overflows): no cycle time, so no idle phase to draw.
  if (Number.isFinite(cycleS)) {
    // Neutral: all the shaft power becomes heat, so the heat balance's figure is the motor's.
    add("neutral", null, false, cycleS - busyS, 0, pump.neutral, d.heat.neutralLossKw);
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
