/**
 * The plain tables of an axis's requirements: limits, defaults and choices. No zod here, so a
 * page that shows a field's limits or choices does not carry the schema library; the schema
 * (requirements.ts, with its messages) builds its checks from these same tables.
 */

export interface NumberLimit {
  readonly min: number;
  readonly max: number;
  /** true: the value must be above min, not equal to it */
  readonly minExclusive?: boolean;
  /** true: the value must be below max, not equal to it */
  readonly maxExclusive?: boolean;
}

/** Bounds of every numeric field, in the unit its name carries. */
export const REQUIREMENT_LIMITS = {
  inclineDeg: { min: 0, max: 90, minExclusive: true, maxExclusive: true },
  massKg: { min: 0, max: 500_000 },
  processForceN: { min: 0, max: 10_000_000 },
  frictionCoefficient: { min: 0, max: 1 },
  strokeMm: { min: 0, max: 10_000, minExclusive: true },
  extendSpeedMmS: { min: 0, max: 2000, minExclusive: true },
  retractSpeedMmS: { min: 0, max: 2000, minExclusive: true },
  pressStrokeMm: { min: 0, max: 10_000 },
  pressSpeedMmS: { min: 0, max: 2000, minExclusive: true },
  dwellS: { min: 0, max: 3600 },
  holdMinutes: { min: 0, max: 10_080 },
  accelTimeS: { min: 0, max: 10, minExclusive: true },
  decelTimeS: { min: 0, max: 10, minExclusive: true },
  cyclesPerHour: { min: 0, max: 3600 },
  hoursPerDay: { min: 0, max: 24 },
  ambientC: { min: -30, max: 55 },
  maxPressureBar: { min: 20, max: 250 },
} as const satisfies Record<string, NumberLimit>;

/**
 * Values the engine takes when a field is left out (sizing contract). decelTimeS is absent
 * here on purpose: it defaults to the axis's own accelTimeS.
 */
export const REQUIREMENT_DEFAULTS = {
  processForceN: 0,
  frictionCoefficient: 0.1,
  pressStrokeMm: 0,
  dwellS: 0,
  holdMinutes: 0,
  accelTimeS: 0.2,
  ambientC: 25,
  maxPressureBar: 160,
} as const;

export const ORIENTATIONS = ["horizontal", "vertical", "inclined"] as const;
export const ROD_DIRECTIONS = ["up", "down"] as const;
export const MOUNTINGS = ["fixed-free", "pinned-pinned", "fixed-pinned", "fixed-fixed"] as const;
export const MOUNTING_STYLES = ["front-flange", "rear-flange", "trunnion", "clevis", "foot"] as const;
export const PUMP_TYPES = ["fixed", "double", "compensated"] as const;
export const SUPPLY_FREQUENCIES = [50, 60] as const;
/** Longest axis name, in characters. */
export const NAME_MAX = 80;
