/**
 * The phases of an extension with a pressing stroke: an approach at extendSpeedMmS with no
 * process force, then the pressing stroke at pressSpeedMmS against the process force, then
 * the dwell. Without a pressing stroke the whole extension is one phase (version-1 behaviour).
 */

/** Cylinder flow for a piston speed, Q = A·v (continuity): L/min from mm² and mm/s. */
export const phaseFlowLpm = (areaMm2: number, speedMmS: number): number => (areaMm2 * speedMmS * 0.06) / 1000;

export interface ExtensionTimes {
  /** time at approach speed (the whole stroke without a pressing phase) */
  approachS: number;
  /** time at pressing speed (0 without a pressing phase) */
  pressS: number;
}

/** t = s / v per phase; the approach covers the stroke less the pressing stroke. */
export function extensionTimes(strokeMm: number, pressStrokeMm: number, approachMmS: number, pressMmS: number | undefined): ExtensionTimes {
  if (pressStrokeMm <= 0 || pressMmS === undefined) return { approachS: strokeMm / approachMmS, pressS: 0 };
  if (pressMmS <= 0) throw new RangeError("A pressing stroke needs a pressing speed above 0 mm/s.");
  return { approachS: (strokeMm - pressStrokeMm) / approachMmS, pressS: pressStrokeMm / pressMmS };
}
