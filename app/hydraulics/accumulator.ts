/**
 * A gas-loaded accumulator that carries a machine cycle's flow peaks, so the pump is sized near the
 * cycle's mean flow instead of its peak (sources §11.6, "flow-peak support"): the pump charges it
 * through a check valve between p1 and p2, the axes draw from both while they move, and the pump
 * refills it before the next cycle. Pure functions; machine.ts decides where it is fitted.
 */
import { A } from "./assumptions";
import type { TimelinePhase } from "./machine-timeline";
import { pumpDeliveryLpm, requiredDisplacementCc, selectDisplacementCc } from "./pump-motor";
import { ISO3662_DISPLACEMENTS_CC, nextInSeries } from "./series";

/** Nominal gas volumes of bladder accumulators, L (a maker's range, from memory [M]). */
export const ACCUMULATOR_SIZES_L: readonly number[] = [0.2, 0.5, 1, 1.5, 2.5, 4, 5, 10, 13, 20, 24, 32, 50];

/** Gauge to absolute pressure: the gas law takes absolute pressures (add ≈ 1 bar) [D]. */
const abs = (bar: number): number => bar + 1;
const roundUp5 = (bar: number): number => Math.ceil(bar / A.reliefRoundingBar.value - 1e-9) * A.reliefRoundingBar.value;

/**
 * Gas volume at precharge for a usable oil volume ΔV between p1 and p2 (p·Vⁿ = const):
 * V0 = ΔV / [(p0/p1)^(1/n) − (p0/p2)^(1/n)], absolute pressures (ideal gas; a maker's accumulator page) [D].
 */
export function accumulatorGasVolumeL(usableL: number, p0Bar: number, p1Bar: number, p2Bar: number, n: number): number {
  return usableL / ((abs(p0Bar) / abs(p1Bar)) ** (1 / n) - (abs(p0Bar) / abs(p2Bar)) ** (1 / n));
}

/** Oil an accumulator holds at p2 once the gas has cooled (isothermal): V0·(1 − p0/p2), absolute [D]. */
export const accumulatorOilAtL = (gasVolumeL: number, p0Bar: number, pBar: number): number => gasVolumeL * (1 - abs(p0Bar) / abs(pBar));

export interface AccumulatorPlan {
  displacementCc: number;
  qpLpm: number;
  requiredDisplacementCc: number;
  meanLpm: number;
  cycleOilL: number;
  highestNeedBar: number;
  minBar: number;
  maxBar: number;
  prechargeBar: number;
  reliefBar: number;
  usableL: number;
  gasVolumeL: number;
  nominalL: number;
  oilAtMaxL: number;
  /** time after the motions for the pump to refill what the cycle took, s */
  rechargeS: number;
  reason: string;
}

export interface AccumulatorInput {
  timeline: TimelinePhase[];
  cyclesPerHour: number;
  speedRpm: number;
  /** the pump the machine gets without one, and the highest shaft power it draws in the cycle */
  withoutCc: number;
  withoutPeakKw: number;
  /** highest working pressure the buyer accepts, and the lowest cylinder rating of the machine */
  maxPressureBar: number;
  ratedBar: number;
}

/**
 * An accumulator where it pays: a known cycle of fast motions only (a pressing stroke or a dwell
 * at force keeps its own pump logic), a pump at least two sizes smaller for 1.25 × the mean flow
 * and a motor peak at least 3 kW lower,
 * pressures within the buyer's limit and every cylinder's rating, time to recharge before the
 * next cycle, and a size in the range. Null otherwise.
 */
export function planAccumulator(i: AccumulatorInput): AccumulatorPlan | null {
  const etaV = A.volumetricEfficiency.value;
  if (!(i.cyclesPerHour > 0) || i.timeline.length === 0 || i.timeline.some((p) => p.kind !== "fast")) return null;
  const cycleS = 3600 / i.cyclesPerHour;
  // So few cycles that the time overflows: no cycle to refill within (as cycle.ts treats it).
  if (!Number.isFinite(cycleS)) return null;
  const busyS = i.timeline.reduce((s, p) => s + p.durationS, 0);
  const cycleOilL = i.timeline.reduce((s, p) => s + (p.demandLpm * p.durationS) / 60, 0);
  const meanLpm = (60 * cycleOilL) / cycleS;
  const requiredCc = requiredDisplacementCc(A.accumulatorMeanMargin.value * meanLpm, i.speedRpm, etaV);
  const displacementCc = selectDisplacementCc(requiredCc).displacementCc;
  const steps = ISO3662_DISPLACEMENTS_CC.indexOf(i.withoutCc) - ISO3662_DISPLACEMENTS_CC.indexOf(displacementCc);
  if (steps < A.accumulatorMinSteps.value) return null;
  const qp = pumpDeliveryLpm(displacementCc, i.speedRpm, etaV);

  // Pressures: p1 above every axis's need by the control's drop, p2 a band above it, p0 below p1.
  const highestNeedBar = Math.max(...i.timeline.map((p) => p.needBar));
  const minBar = roundUp5(highestNeedBar + A.accumulatorControlDropBar.value);
  const maxBar = roundUp5(minBar * (1 + A.accumulatorBand.value));
  const prechargeBar = A.accumulatorPrechargeRatio.value * minBar;
  const reliefBar = roundUp5(maxBar * (1 + A.reliefMargin.value));
  if (maxBar > i.maxPressureBar + 1e-9 || reliefBar > i.ratedBar + 1e-9) return null;
  // Worth its cost only where the motor's peak comes down by a few kW (p2·Q_p/600/η beside the pump charging).
  if (i.withoutPeakKw - (maxBar * qp) / 600 / A.overallEfficiency.value < A.accumulatorMinSavingKw.value) return null;

  // Oil the accumulator must give: the deepest it is drawn down in the cycle, with the pump
  // delivering Q_p throughout the motions and the accumulator full at the start (§11.6, ΔV = V_move − Q_p·t/60) [D].
  let deficitL = 0;
  let usableL = 0;
  for (const p of i.timeline) {
    deficitL = Math.max(0, deficitL + ((p.demandLpm - qp) * p.durationS) / 60);
    usableL = Math.max(usableL, deficitL);
  }
  const rechargeS = (60 * deficitL) / qp;
  if (usableL <= 0 || busyS + rechargeS > cycleS + 1e-9) return null;
  const gasVolumeL = accumulatorGasVolumeL(usableL, prechargeBar, minBar, maxBar, A.accumulatorExponent.value);
  const nominalL = nextInSeries(ACCUMULATOR_SIZES_L, gasVolumeL);
  if (nominalL === undefined) return null;
  return {
    displacementCc,
    qpLpm: qp,
    requiredDisplacementCc: requiredCc,
    meanLpm,
    cycleOilL,
    highestNeedBar,
    minBar,
    maxBar,
    prechargeBar,
    reliefBar,
    usableL,
    gasVolumeL,
    nominalL,
    oilAtMaxL: accumulatorOilAtL(nominalL, prechargeBar, maxBar),
    rechargeS,
    reason: `an accumulator carries the flow peaks: the axes draw ${cycleOilL.toFixed(2)} L a cycle, ${meanLpm.toFixed(1)} L/min on average, so a ${displacementCc} cm³/rev pump refills it between cycles where the peaks would need ${i.withoutCc} cm³/rev`,
  };
}
