import { A } from "./assumptions";
import { extensionTimes } from "./phases";

/** Oil a double-acting cylinder keeps out of the tank when extended: cap-end volume in minus rod-end volume back, A_rod·s, in L [D]. */
export const cylinderDrawL = (capAreaMm2: number, annulusAreaMm2: number, strokeMm: number): number => ((capAreaMm2 - annulusAreaMm2) * strokeMm) / 1e6;

/**
 * Usable volume = 4 × pump flow per minute (3–5 × is common practice) plus the oil the cylinder
 * draws from the tank, rounded up to 5 L: the level must not fall into the pump's suction when
 * the rod is out, so the draw is added to the rule, not compared with it.
 */
export function reservoirVolumeL(pumpFlowLpm: number, cylinderDrawLitres: number): number {
  const step = A.reservoirRoundingL.value;
  return Math.ceil((A.reservoirMultiple.value * pumpFlowLpm + cylinderDrawLitres) / step - 1e-9) * step;
}

/** Cube-like tank: A ≈ 6·V^(2/3), V in m³ [D]/[CP]. */
export const tankSurfaceM2 = (volumeL: number): number => 6 * Math.cbrt((volumeL / 1000) ** 2);

/** Φ = k·A·ΔT, in kW. */
export const tankDissipationKw = (surfaceM2: number, ambientC: number): number =>
  (A.tankHeatTransfer.value * surfaceM2 * Math.max(0, A.oilTemperatureLimit.value - ambientC)) / 1000;

export interface DutyShares {
  /** time at approach speed (the whole extension without a pressing stroke) */
  extendS: number;
  /** time at pressing speed (0 without a pressing stroke) */
  pressS: number;
  retractS: number;
  dwellS: number;
  /** share of running time spent moving on each stroke, dwelling at force, and in neutral */
  extendShare: number;
  pressShare: number;
  retractShare: number;
  dwellShare: number;
  neutralShare: number;
  /** true when the cycles asked for do not fit in an hour */
  overloaded: boolean;
}

/**
 * Share of each hour spent in each phase: approach, pressing, retract, dwell; the rest is
 * neutral. A pressing stroke (press) splits the extension into approach and pressing times.
 */
export function dutyShares(
  strokeMm: number,
  extendMmS: number,
  retractMmS: number,
  cyclesPerHour: number,
  dwellS = 0,
  press?: { strokeMm: number; speedMmS: number },
): DutyShares {
  const { approachS: extendS, pressS } = extensionTimes(strokeMm, press?.strokeMm ?? 0, extendMmS, press?.speedMmS);
  const retractS = strokeMm / retractMmS;
  let extendShare = (cyclesPerHour * extendS) / 3600;
  let pressShare = (cyclesPerHour * pressS) / 3600;
  let retractShare = (cyclesPerHour * retractS) / 3600;
  let dwellShare = (cyclesPerHour * dwellS) / 3600;
  const busy = extendShare + pressShare + retractShare + dwellShare;
  const overloaded = busy > 1;
  if (overloaded) {
    extendShare /= busy;
    pressShare /= busy;
    retractShare /= busy;
    dwellShare /= busy;
  }
  return {
    extendS,
    pressS,
    retractS,
    dwellS,
    extendShare,
    pressShare,
    retractShare,
    dwellShare,
    neutralShare: Math.max(0, 1 - extendShare - pressShare - retractShare - dwellShare),
    overloaded,
  };
}

/**
 * Heat into the oil while a stroke runs at constant speed: shaft power minus the work the
 * rod does on the load. For a lowering stroke that work is negative, so the load's energy
 * (throttled in the counterbalance valve) is added.
 */
export const strokeHeatKw = (shaftKw: number, steadyForceN: number, speedMmS: number): number => Math.max(0, shaftKw - (steadyForceN * speedMmS) / 1e6);
