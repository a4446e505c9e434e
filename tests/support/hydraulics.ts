// Single axes that several engine, component and bench tests size, each named for where it comes
// from, so a check value worked by hand reads the same inputs everywhere it is checked.
import fc from "fast-check";
import { NotSizableError, sizeCircuit, type Design, type RequirementsInput } from "~/hydraulics";

/**
 * The shared sources' reference axis (sources §11.0): a 100/70 press, 400 mm stroke, 100 kN over
 * the last 20 mm at 0.01 m/s, approach and return 0.2 m/s. Horizontal, 500 kg on guides with the
 * default μ 0.1, fixed-fixed; 60 cycles/h, 8 h/day, 50 Hz. Tests add a dwell, flange or pump.
 */
export const REFERENCE_PRESS = {
  orientation: "horizontal",
  massKg: 500,
  processForceN: 100_000,
  strokeMm: 400,
  extendSpeedMmS: 200,
  retractSpeedMmS: 200,
  pressStrokeMm: 20,
  pressSpeedMmS: 10,
  mounting: "fixed-fixed",
  cyclesPerHour: 60,
  hoursPerDay: 8,
  supplyHz: 50,
} as const satisfies RequirementsInput;

/** 1.6 m horizontal feed, 50 kN at the end of the stroke, 200 mm/s both ways: it regenerates (regenerative.test.ts). */
export const LONG_FEED = {
  orientation: "horizontal",
  massKg: 500,
  processForceN: 50_000,
  strokeMm: 1600,
  extendSpeedMmS: 200,
  retractSpeedMmS: 200,
  mounting: "fixed-pinned",
  mountingStyle: "rear-flange",
  cyclesPerHour: 60,
  hoursPerDay: 8,
  supplyHz: 50,
} as const satisfies RequirementsInput;

/** A 2 t platen hanging from the rod, 150 kN over the last 50 mm of a 1 m stroke, approach and return 200 mm/s, a 2 s dwell. */
export const HANGING_PRESS = {
  orientation: "vertical",
  rodDirection: "down",
  massKg: 2000,
  processForceN: 150000,
  strokeMm: 1000,
  extendSpeedMmS: 200,
  retractSpeedMmS: 200,
  pressStrokeMm: 50,
  pressSpeedMmS: 10,
  dwellS: 2,
  mounting: "fixed-pinned",
  cyclesPerHour: 60,
  hoursPerDay: 8,
  supplyHz: 50,
} as const satisfies RequirementsInput;

/** Worked example 1's axis (worked-examples.test.ts): a horizontal clamp feed, 38 kN at the end of a 300 mm stroke. */
export const CLAMP_FEED = {
  orientation: "horizontal",
  massKg: 1000,
  processForceN: 38000,
  strokeMm: 300,
  extendSpeedMmS: 100,
  retractSpeedMmS: 150,
  mounting: "fixed-fixed",
  cyclesPerHour: 60,
  hoursPerDay: 8,
  supplyHz: 50,
} as const satisfies RequirementsInput;

/** Worked example 2's axis (worked-examples.test.ts): a vertical press, rod down, 1.5 t and 60 kN over a 400 mm stroke. */
export const ROD_DOWN_PRESS = {
  orientation: "vertical",
  rodDirection: "down",
  massKg: 1500,
  processForceN: 60000,
  strokeMm: 400,
  extendSpeedMmS: 80,
  retractSpeedMmS: 120,
  mounting: "fixed-pinned",
  cyclesPerHour: 30,
  hoursPerDay: 8,
  supplyHz: 50,
} as const satisfies RequirementsInput;

/** The design, or null where nothing in the series meets the pressures (NotSizableError says why). */
export function sizedOrNull(req: RequirementsInput): Design | null {
  try {
    return sizeCircuit(req);
  } catch (e) {
    if (e instanceof NotSizableError) return null;
    throw e;
  }
}

/**
 * Five axes across the accepted range for the series checks and the engine bench: a horizontal
 * feed with a process force, a hanging press, a heavy lift, and an incline either way.
 */
export const AXIS_MIX: RequirementsInput[] = [
  {
    orientation: "horizontal",
    massKg: 800,
    processForceN: 30000,
    strokeMm: 400,
    extendSpeedMmS: 120,
    retractSpeedMmS: 200,
    mounting: "fixed-fixed",
    cyclesPerHour: 120,
    hoursPerDay: 16,
    supplyHz: 50,
  },
  {
    orientation: "vertical",
    rodDirection: "down",
    massKg: 2500,
    processForceN: 150000,
    strokeMm: 600,
    extendSpeedMmS: 80,
    retractSpeedMmS: 120,
    mounting: "fixed-pinned",
    cyclesPerHour: 40,
    hoursPerDay: 8,
    supplyHz: 50,
  },
  {
    orientation: "vertical",
    rodDirection: "up",
    massKg: 4000,
    strokeMm: 1200,
    extendSpeedMmS: 60,
    retractSpeedMmS: 90,
    mounting: "pinned-pinned",
    cyclesPerHour: 20,
    hoursPerDay: 8,
    supplyHz: 60,
  },
  {
    orientation: "inclined",
    inclineDeg: 35,
    rodDirection: "up",
    massKg: 1200,
    strokeMm: 900,
    extendSpeedMmS: 150,
    retractSpeedMmS: 150,
    mounting: "pinned-pinned",
    cyclesPerHour: 30,
    hoursPerDay: 12,
    supplyHz: 50,
    maxPressureBar: 210,
  },
  {
    orientation: "inclined",
    inclineDeg: 60,
    rodDirection: "down",
    massKg: 300,
    strokeMm: 250,
    extendSpeedMmS: 300,
    retractSpeedMmS: 400,
    mounting: "fixed-free",
    cyclesPerHour: 300,
    hoursPerDay: 20,
    supplyHz: 60,
  },
];

/**
 * A property over random axes (fast-check): `check` holds for the design of every axis `axes`
 * yields that the series can size; axes nothing in the series meets are left out (fc.pre).
 */
export function forEveryDesign(axes: fc.Arbitrary<RequirementsInput>, check: (d: Design, req: RequirementsInput) => void, numRuns = 300): void {
  fc.assert(
    fc.property(axes, (req) => {
      const d = sizedOrNull(req);
      fc.pre(d !== null);
      check(d!, req);
    }),
    { numRuns },
  );
}
