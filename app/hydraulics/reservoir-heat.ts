import { A } from "./assumptions";

/** Oil a double-acting cylinder keeps out of the tank when extended: cap-end volume in minus rod-end volume back, A_rod·s, in L [D]. */
export const cylinderDrawL = (capAreaMm2: number, annulusAreaMm2: number, strokeMm: number): number =>
  ((capAreaMm2 - annulusAreaMm2) * strokeMm) / 1e6;

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
  extendS: number;
  retractS: number;
  dwellS: number;
  /** share of running time spent moving on each stroke, dwelling at force, and in neutral */
  extendShare: number;
  retractShare: number;
  dwellShare: number;
  neutralShare: number;
  /** true when the cycles asked for do not fit in an hour */
  overloaded: boolean;
}

export function dutyShares(strokeMm: number, extendMmS: number, retractMmS: number, cyclesPerHour: number, dwellS = 0): DutyShares {
  const extendS = strokeMm / extendMmS;
  const retractS = strokeMm / retractMmS;
  let extendShare = (cyclesPerHour * extendS) / 3600;
  let retractShare = (cyclesPerHour * retractS) / 3600;
  let dwellShare = (cyclesPerHour * dwellS) / 3600;
  const busy = extendShare + retractShare + dwellShare;
  const overloaded = busy > 1;
  if (overloaded) {
    extendShare /= busy;
    retractShare /= busy;
    dwellShare /= busy;
  }
  return {
    extendS, retractS, dwellS, extendShare, retractShare, dwellShare,
    neutralShare: Math.max(0, 1 - extendShare - retractShare - dwellShare), overloaded,
  };
}

/**
 * Heat into the oil while a stroke runs at constant speed: shaft power minus the work the
 * rod does on the load. For a lowering stroke that work is negative, so the load's energy
 * (throttled in the counterbalance valve) is added.
 */
export const strokeHeatKw = (shaftKw: number, steadyForceN: number, speedMmS: number): number =>
  Math.max(0, shaftKw - (steadyForceN * speedMmS) / 1e6);
