/**
 * Which pump feeds the axis and what it draws in each phase of the cycle: a fixed pump, a
 * double (high-low) pump whose large section unloads once the pressing pressure builds, or a
 * pressure-compensated pump, with a power limiter where high flow and high pressure never meet.
 */
import { A } from "./assumptions";
import { pressNeedsControl } from "./press-speed";
import { pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import type { PUMP_TYPES } from "./requirements";

export type PumpType = (typeof PUMP_TYPES)[number];

export interface PhaseDemand {
  /** pump pressure and cylinder flow in the approach (the whole extension without pressing) */
  approachBar: number;
  retractBar: number;
  /** pressing pressure and flow; null without a pressing stroke */
  press: { bar: number; flowLpm: number } | null;
  reliefBar: number;
  /** the highest working pressure (the compensator is set from it) */
  workingBar: number;
  /** total displacement and delivery the fast phases need */
  displacementCc: number;
  pumpFlowLpm: number;
  speedRpm: number;
}

export interface PumpChoice {
  type: PumpType;
  /** large section first for a double pump */
  displacementsCcRev: number[];
  unloadingBar: number | null;
  compensatorBar: number | null;
  /** shaft power the limiter holds the pump to; null without one */
  powerLimitKw: number | null;
  /** why this pump, in words */
  reason: string;
  /** hydraulic power the pump draws in each phase, kW (shaft power = this / η_overall) */
  hydraulicKw: { approach: number; unloadingPeak: number; press: number; dwell: number; retract: number };
}

const hyd = (bar: number, lpm: number): number => (bar * lpm) / 600;
const roundUp5 = (bar: number): number => Math.ceil(bar / A.reliefRoundingBar.value - 1e-9) * A.reliefRoundingBar.value;

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
  return {
    type: "fixed", displacementsCcRev: [d.displacementCc], unloadingBar: null, compensatorBar: null, powerLimitKw: null, reason,
    // A fixed pump delivers its whole flow at whatever pressure the circuit reaches: while
    // pressing slower than the pump and in the dwell it sits at the relief (trade-press pump articles).
    hydraulicKw: {
      approach: hyd(d.approachBar, q), unloadingPeak: 0, press: d.press ? hyd(d.reliefBar, q) : 0, dwell: hyd(d.reliefBar, q), retract: hyd(d.retractBar, q),
    },
  };
}

/** A double pump if its sections and unloading setting work for these phases, else null. */
function double(d: PhaseDemand, reason: string): PumpChoice | null {
  if (!d.press) return null;
  const etaV = A.volumetricEfficiency.value;
  const small = selectDisplacementCc(requiredDisplacementCc(d.press.flowLpm, d.speedRpm, etaV)).displacementCc;
  const large = d.displacementCc - small;
  if (large <= 0) return null;
  const fastBar = Math.max(d.approachBar, d.retractBar);
  const pu = unloadingSettingBar(fastBar);
  if (pu > A.unloadingBelowPressRatio.value * d.press.bar) return null;
  const qS = pumpDeliveryLpm(small, d.speedRpm, etaV);
  const qL = pumpDeliveryLpm(large, d.speedRpm, etaV);
  const { beforeUnloadingKw, atForceKw: atForce } = highLowPowerKw(qL, qS, pu, d.reliefBar, A.unloadedDropBar.value);
  return {
    type: "double", displacementsCcRev: [large, small], unloadingBar: pu, compensatorBar: null, powerLimitKw: null, reason,
    hydraulicKw: {
      approach: hyd(d.approachBar, qS + qL),
      // both sections just before the large one unloads: the high-low pump's peak
      unloadingPeak: beforeUnloadingKw,
      // Pressing: a small section that suits the pressing speed pumps straight into the cap end at
      // the pressing pressure; one that is too fast feeds a flow control and sits at the relief.
      press: pressNeedsControl(qS, d.press.flowLpm) ? atForce : hyd(d.press.bar, qS) + hyd(A.unloadedDropBar.value, qL),
      dwell: atForce,
      retract: hyd(d.retractBar, qS + qL),
    },
  };
}

/**
 * p_c somewhat above the highest working pressure (trade-press pump article), rounded up to 5 bar.
 * With a pressing stroke the meter-in flow control needs its regulating drop on top of the
 * pressing pressure, so p_c rises towards it, but stays about 10 bar under the relief so the
 * relief never opens in normal work (both common practice); press-speed.ts warns if it falls short.
 */
export function compensatorSettingBar(d: Pick<PhaseDemand, "workingBar" | "press" | "reliefBar">): number {
  const base = roundUp5(d.workingBar);
  if (!d.press) return base;
  const step = A.reliefRoundingBar.value;
  const belowRelief = Math.floor((d.reliefBar - A.compensatorReliefGapBar.value) / step + 1e-9) * step;
  return Math.max(base, Math.min(roundUp5(d.press.bar + A.flowControlMinDropBar.value), belowRelief));
}

function compensated(d: PhaseDemand, reason: string, limiter: boolean): PumpChoice {
  const q = d.pumpFlowLpm;
  const pc = compensatorSettingBar(d);
  const leak = A.compensatorLeakShare.value * q;
  const hydraulicKw = {
    approach: hyd(d.approachBar, q),
    unloadingPeak: 0,
    // While pressing, the meter-in control passes the pressing flow and the pump holds p_c,
    // destroking to that flow; in the dwell it delivers only its leakage (compensated-pump behaviour).
    // Without a pressing stroke the force is reached at standstill: the pump destrokes to its leakage.
    press: d.press ? hyd(pc, d.press.flowLpm) : hyd(pc, leak),
    dwell: hyd(pc, leak),
    retract: hyd(d.retractBar, q),
  };
  // Without a limiter the corner p_c·Q_max can be reached on the way up to pressure.
  const phaseMax = Math.max(hydraulicKw.approach, hydraulicKw.press, hydraulicKw.retract);
  const corner = hyd(pc, q);
  const useLimiter = limiter && corner > phaseMax * (1 + 1e-9);
  return {
    type: "compensated", displacementsCcRev: [d.displacementCc], unloadingBar: null, compensatorBar: pc,
    powerLimitKw: useLimiter ? phaseMax / A.overallEfficiency.value : null, reason,
    hydraulicKw: useLimiter ? hydraulicKw : { ...hydraulicKw, unloadingPeak: corner },
  };
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
    return double(d, "a double (high-low) pump, as asked")
      ?? fixed(d, d.press
        ? "a double pump was asked, but its unloading valve cannot sit clearly between the fast-motion and pressing pressures, so a fixed pump is sized"
        : "a double pump was asked, but without a pressing stroke there is no slow, high-pressure phase for its small section, so a fixed pump is sized");
  }
  if (!d.press || ratio < A.twoSpeedFlowRatio.value) {
    return fixed(d, d.press
      ? `a fixed pump: the fast flow is only ${ratio.toFixed(1)} × the pressing flow, so one pump at pressing pressure costs little extra`
      : "a fixed pump: the axis has one speed range, so one pump size serves every phase");
  }
  const why = `the fast flow is ${ratio.toFixed(1)} × the pressing flow, and high flow and high pressure never meet in this cycle`;
  return double(d, `a double (high-low) pump: ${why}; both sections feed the approach, the small one alone builds the pressing force, and the large one unloads to tank`)
    ?? compensated(d, `a pressure-compensated pump with a power limiter: ${why}, but the fast motion needs too much pressure for an unloading valve to sit clearly below the pressing pressure`, true);
}
