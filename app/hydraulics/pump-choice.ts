/**
 * Which pump feeds the axis and what it draws in each phase of the cycle: a fixed pump, a
 * double (high-low) pump whose large section unloads once the pressing pressure builds, or a
 * pressure-compensated pump, with a power limiter where high flow and high pressure never meet.
 */
import { A } from "./assumptions";
import type { Design } from "./design";
import { pressNeedsControl } from "./press-speed";
import { pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import type { PUMP_TYPES } from "./requirement-limits";
import { ISO3662_DISPLACEMENTS_CC } from "./series";

export type PumpType = (typeof PUMP_TYPES)[number];

export interface PhaseDemand {
  /** pump pressure and cylinder flow in the approach (the whole extension without pressing) */
  approachBar: number;
  retractBar: number;
  /** pressing pressure and flow; null without a pressing stroke */
  press: { bar: number; flowLpm: number } | null;
  /** relief of a fixed or double pump: about 10 % above the highest working pressure */
  reliefBar: number;
  /** the highest working pressure (the compensator is set from it) */
  workingBar: number;
  /** the cylinder's rating: no relief is set above it */
  ratedBar: number;
  /** displacement the fast phases need (before rounding to the series), then the size and delivery evaluated */
  requiredDisplacementCc: number;
  displacementCc: number;
  pumpFlowLpm: number;
  speedRpm: number;
  /** the double pump was tried with its sections' total and turned away: choose as if it could not be built */
  noDouble?: boolean;
}

/**
 * What the pump does in one phase: its outlet pressure, what it delivers to the circuit, and the
 * hydraulic power it draws (p·Q/600, plus, for a double pump, the large section dumping at Δp_u).
 */
export interface PumpPhase {
  bar: number;
  lpm: number;
  kw: number;
}

/** The phases the pump choice reports; neutral follows from the valve centre (pumpPhaseInNeutral). */
export const PUMP_PHASES = ["approach", "unloadingPeak", "press", "dwell", "retract"] as const;
export type PumpPhaseName = (typeof PUMP_PHASES)[number];

export interface PumpChoice {
  type: PumpType;
  /** large section first for a double pump */
  displacementsCcRev: number[];
  unloadingBar: number | null;
  compensatorBar: number | null;
  /** relief setting: a fixed or double pump's as asked, a compensated pump's set from its compensator */
  reliefBar: number;
  /** why the compensator sits below what the working pressure and the pressing control ask; null where it does not */
  compensatorNote: string | null;
  /** shaft power the limiter holds the pump to; null without one */
  powerLimitKw: number | null;
  /** why this pump, in words */
  reason: string;
  /** each phase the pump passes through; null where the pump never reaches it (no pressing, no unloading peak) */
  phases: Record<PumpPhaseName, PumpPhase | null>;
  /** hydraulic power the pump draws in each phase, kW (shaft power = this / η_overall); read from phases */
  hydraulicKw: Record<PumpPhaseName, number>;
}

/** The design's pump from the choice, an axis's and a machine power unit's alike; only the sizes the caller reached differ. */
export function designPump(choice: PumpChoice, sized: { displacementCcRev: number; speedRpm: number; requiredDisplacementCcRev: number }): Design["pump"] {
  return {
    type: choice.type,
    displacementCcRev: sized.displacementCcRev,
    displacementsCcRev: choice.displacementsCcRev,
    ...(choice.unloadingBar !== null ? { unloadingBar: choice.unloadingBar, unloadedDropBar: A.unloadedDropBar.value } : {}),
    ...(choice.compensatorBar !== null ? { compensatorBar: choice.compensatorBar } : {}),
    ...(choice.powerLimitKw !== null ? { powerLimitKw: choice.powerLimitKw } : {}),
    reason: choice.reason,
    speedRpm: sized.speedRpm,
    requiredDisplacementCcRev: sized.requiredDisplacementCcRev,
    volumetricEfficiency: A.volumetricEfficiency.value,
    overallEfficiency: A.overallEfficiency.value,
  };
}

const hyd = (bar: number, lpm: number): number => (bar * lpm) / 600;
/** A fixed or a double pump: no compensator to set, so no note on it and no power limiter. */
const NO_COMPENSATOR = { compensatorBar: null, compensatorNote: null, powerLimitKw: null } as const;
const step5 = (): number => A.reliefRoundingBar.value;
const roundUp5 = (bar: number): number => Math.ceil(bar / step5() - 1e-9) * step5();
const roundDown5 = (bar: number): number => Math.floor(bar / step5() + 1e-9) * step5();
const at = (bar: number, lpm: number, kw = hyd(bar, lpm)): PumpPhase => ({ bar, lpm, kw });

function withPower(c: Omit<PumpChoice, "hydraulicKw">): PumpChoice {
  const hydraulicKw = Object.fromEntries(PUMP_PHASES.map((name) => [name, c.phases[name]?.kw ?? 0])) as Record<PumpPhaseName, number>;
  return { ...c, hydraulicKw };
}

/**
 * Standby leakage of a destroked compensated pump: Q_leak ≈ (1 − η_v)·Q_max, a first estimate
 * from memory [M] (makers quote it as case-drain flow). The one place the estimate is made.
 */
export const compensatorLeakLpm = (pumpFlowLpm: number): number => A.compensatorLeakShare.value * pumpFlowLpm;

/** Unloading setting: above every pressure both sections must deliver at, with a margin [CP]. */
export function unloadingSettingBar(fastBar: number): number {
  return roundUp5(Math.max(fastBar * (1 + A.unloadingMarginRatio.value), fastBar + A.unloadingMarginMinBar.value));
}

/**
 * Hydraulic power of a high-low pump at its two extremes: both sections at the unloading
 * setting just before the large one unloads, and, at force, the small section over the relief
 * with the large one dumping at Δp_u (P = p·Q/600, summed over the sections) [D].
 */
export function highLowPowerKw(qLargeLpm: number, qSmallLpm: number, unloadingBar: number, reliefBar: number, unloadedDropBar: number) {
  return {
    beforeUnloadingKw: hyd(unloadingBar, qLargeLpm + qSmallLpm),
    atForceKw: hyd(reliefBar, qSmallLpm) + hyd(unloadedDropBar, qLargeLpm),
  };
}

function fixed(d: PhaseDemand, reason: string): PumpChoice {
  const q = d.pumpFlowLpm;
  // A fixed pump delivers its whole flow at whatever pressure the circuit reaches: while
  // pressing slower than the pump and in the dwell it sits at the relief (trade-press pump articles).
  return withPower({
    type: "fixed",
    displacementsCcRev: [d.displacementCc],
    unloadingBar: null,
    reliefBar: d.reliefBar,
    ...NO_COMPENSATOR,
    reason,
    phases: {
      approach: at(d.approachBar, q),
      unloadingPeak: null,
      press: d.press ? at(d.reliefBar, q) : null,
      dwell: at(d.reliefBar, q),
      retract: at(d.retractBar, q),
    },
  });
}

/**
 * The sections of a double pump, each an ISO 3662 size (a maker builds one from two catalogue
 * sizes on one shaft, so their total is rarely a size of the series): the small one at least the
 * size for the pressing flow, the large one for what the fast phases need beyond it. Where the
 * small section's fit is already too fast to press without a flow control, it may go up to two
 * sizes, staying the smaller of the two, if that saves a step of the large one: of those pairs the
 * smallest total, and of equal totals the smaller small section (common practice [CP]).
 */
export function doubleSectionsCc(requiredCc: number, pressFlowLpm: number, speedRpm: number): { large: number; small: number } | null {
  const etaV = A.volumetricEfficiency.value;
  const fitCc = selectDisplacementCc(requiredDisplacementCc(pressFlowLpm, speedRpm, etaV)).displacementCc;
  const fit = ISO3662_DISPLACEMENTS_CC.indexOf(fitCc);
  // A fit that presses at its speed without a flow control keeps it; one that needs the control anyway may grow.
  const steps = pressNeedsControl(pumpDeliveryLpm(fitCc, speedRpm, etaV), pressFlowLpm) ? A.doubleSmallSectionSteps.value : 0;
  let best: { large: number; small: number } | null = null;
  for (const small of ISO3662_DISPLACEMENTS_CC.slice(fit, fit + steps + 1)) {
    if (requiredCc - small <= 1e-9) break;
    const large = selectDisplacementCc(requiredCc - small).displacementCc;
    if (best && small > large) break;
    if (!best || large + small < best.large + best.small - 1e-9) best = { large, small };
  }
  return best;
}

/** A double pump if its sections and unloading setting work for these phases, else null. */
function double(d: PhaseDemand, reason: string): PumpChoice | null {
  if (!d.press || d.noDouble) return null;
  const etaV = A.volumetricEfficiency.value;
  const sections = doubleSectionsCc(d.requiredDisplacementCc, d.press.flowLpm, d.speedRpm);
  if (!sections) return null;
  const { large, small } = sections;
  const fastBar = Math.max(d.approachBar, d.retractBar);
  const pu = unloadingSettingBar(fastBar);
  if (pu > A.unloadingBelowPressRatio.value * d.press.bar) return null;
  const qS = pumpDeliveryLpm(small, d.speedRpm, etaV);
  const qL = pumpDeliveryLpm(large, d.speedRpm, etaV);
  // The sizing evaluates the axis again at the sections' total (evaluate.ts), so this is its Q_p.
  const q = pumpDeliveryLpm(large + small, d.speedRpm, etaV);
  const dumpKw = hyd(A.unloadedDropBar.value, qL);
  const { beforeUnloadingKw, atForceKw } = highLowPowerKw(qL, qS, pu, d.reliefBar, A.unloadedDropBar.value);
  // Pressing: a small section that suits the pressing speed pumps straight into the cap end at
  // the pressing pressure; one that is too fast feeds a flow control and sits at the relief.
  const pressBar = pressNeedsControl(qS, d.press.flowLpm) ? d.reliefBar : d.press.bar;
  return withPower({
    type: "double",
    displacementsCcRev: [large, small],
    unloadingBar: pu,
    reliefBar: d.reliefBar,
    ...NO_COMPENSATOR,
    reason,
    phases: {
      // both sections deliver the whole flow (Q_L + Q_S = the pump's delivery)
      approach: at(d.approachBar, q),
      // both sections just before the large one unloads: the high-low pump's peak
      unloadingPeak: at(pu, q, beforeUnloadingKw),
      // above p_u only the small section delivers; the large one dumps Q_L at Δp_u
      press: at(pressBar, qS, hyd(pressBar, qS) + dumpKw),
      dwell: at(d.reliefBar, qS, atForceKw),
      retract: at(d.retractBar, q),
    },
  });
}

/**
 * Relief over a compensator: max(1.1·p_c, p_c + 10 bar), rounded up to 5 bar, so it never opens
 * in normal work (10 % on a maker's page; p_c + 10…20 bar common practice [CP]).
 */
export const compensatedReliefBar = (pcBar: number): number => roundUp5(Math.max(pcBar * (1 + A.reliefMargin.value), pcBar + A.compensatorReliefGapBar.value));

/** The highest compensator whose relief (compensatedReliefBar) stays within a rating. */
const highestCompensatorBar = (ratedBar: number): number => Math.min(ratedBar / (1 + A.reliefMargin.value), ratedBar - A.compensatorReliefGapBar.value);

/** What the working pressure and the pressing control ask of the compensator, before the rating has its say. */
function compensatorWantedBar(d: Pick<PhaseDemand, "workingBar" | "press">): number {
  return Math.max(roundUp5(d.workingBar), d.press ? roundUp5(d.press.bar + A.flowControlMinDropBar.value) : 0);
}

/**
 * p_c somewhat above the highest working pressure (trade-press pump article), rounded up to 5 bar;
 * with a pressing stroke, at least the pressing pressure plus the meter-in control's regulating
 * drop. The relief then sits above it (compensatedReliefBar). Where that relief would pass the
 * cylinder's rating, the compensator comes down first (the control's headroom gives way:
 * PRESS_CONTROL_DROP_LOW says so), to no less than the working pressure itself, unrounded.
 */
export function compensatorSettingBar(d: Pick<PhaseDemand, "workingBar" | "press" | "ratedBar">): number {
  const wanted = compensatorWantedBar(d);
  const top = highestCompensatorBar(d.ratedBar);
  if (wanted <= top + 1e-9) return wanted;
  return Math.max(roundDown5(top), d.workingBar);
}

function compensated(d: PhaseDemand, reason: string, limiter: boolean): PumpChoice {
  const q = d.pumpFlowLpm;
  const pc = compensatorSettingBar(d);
  // pc ≤ the highest compensator the rating allows wherever the working pressure fits the
  // rating's limit (rating / 1.1), which every design the search returns does.
  const reliefBar = compensatedReliefBar(pc);
  const wanted = compensatorWantedBar(d);
  const compensatorNote =
    pc < wanted - 1e-9 ? `brought down from ${wanted} bar so that its relief, ${reliefBar} bar, stays within the cylinder's ${d.ratedBar} bar rating` : null;
  const leak = compensatorLeakLpm(q);
  // While pressing, the meter-in control passes the pressing flow and the pump holds p_c,
  // destroking to that flow; in the dwell it delivers only its leakage (compensated-pump behaviour).
  // Without a pressing stroke the force is reached at standstill: the pump destrokes to its leakage.
  const phases = {
    approach: at(d.approachBar, q),
    press: d.press ? at(pc, d.press.flowLpm) : at(pc, leak),
    dwell: at(pc, leak),
    retract: at(d.retractBar, q),
  };
  // Without a limiter the corner p_c·Q_max can be reached on the way up to pressure.
  const phaseMax = Math.max(phases.approach.kw, phases.press.kw, phases.retract.kw);
  const corner = at(pc, q);
  const useLimiter = limiter && corner.kw > phaseMax * (1 + 1e-9);
  return withPower({
    type: "compensated",
    displacementsCcRev: [d.displacementCc],
    unloadingBar: null,
    compensatorBar: pc,
    reliefBar,
    compensatorNote,
    powerLimitKw: useLimiter ? phaseMax / A.overallEfficiency.value : null,
    reason,
    phases: { ...phases, unloadingPeak: useLimiter ? null : corner },
  });
}

/**
 * The pump in neutral, given the pressure the valve centre leaves at its outlet: a compensated
 * pump at its setting delivers only its leakage (standby); a double pump above its unloading
 * setting only its small section (the large one dumps at Δp_u); otherwise the whole flow.
 */
export function pumpPhaseInNeutral(pump: PumpChoice, pumpFlowLpm: number, speedRpm: number, centreBar: number): PumpPhase {
  if (pump.type === "compensated") return at(pump.compensatorBar!, compensatorLeakLpm(pumpFlowLpm));
  if (pump.type === "double" && centreBar >= pump.unloadingBar! - 1e-9) {
    const qS = pumpDeliveryLpm(pump.displacementsCcRev[1], speedRpm, A.volumetricEfficiency.value);
    return at(centreBar, qS, hyd(centreBar, qS) + hyd(A.unloadedDropBar.value, pumpFlowLpm - qS));
  }
  return at(centreBar, pumpFlowLpm);
}

/**
 * The buyer's pump when given; otherwise what an engineer would pick: a fixed pump for one
 * speed range, a double pump for a fast approach and a slow pressing stroke when the unloading
 * setting fits clearly below the pressing pressure, else a compensated pump with a power limiter.
 */
export function choosePump(d: PhaseDemand, asked: PumpType | undefined): PumpChoice {
  const ratio = d.press ? d.pumpFlowLpm / d.press.flowLpm : 1;
  if (asked === "fixed") return fixed(d, "a fixed pump, as asked");
  if (asked === "compensated") return compensated(d, "a pressure-compensated pump, as asked", true);
  if (asked === "double") {
    return (
      double(d, "a double (high-low) pump, as asked") ??
      fixed(
        d,
        d.press
          ? "a double pump was asked, but its unloading valve cannot sit clearly between the fast-motion and pressing pressures, so a fixed pump is sized"
          : "a double pump was asked, but without a pressing stroke there is no slow, high-pressure phase for its small section, so a fixed pump is sized",
      )
    );
  }
  if (!d.press || ratio < A.twoSpeedFlowRatio.value) {
    return fixed(
      d,
      d.press
        ? `a fixed pump: the fast flow is only ${ratio.toFixed(1)} × the pressing flow, so one pump at pressing pressure costs little extra`
        : "a fixed pump: the axis has one speed range, so one pump size serves every phase",
    );
  }
  const why = `the fast flow is ${ratio.toFixed(1)} × the pressing flow, and high flow and high pressure never meet in this cycle`;
  return (
    double(
      d,
      `a double (high-low) pump: ${why}; both sections feed the approach, the small one alone builds the pressing force, and the large one unloads to tank`,
    ) ??
    compensated(
      d,
      `a pressure-compensated pump with a power limiter: ${why}, but the fast motion needs too much pressure for an unloading valve to sit clearly below the pressing pressure`,
      true,
    )
  );
}
