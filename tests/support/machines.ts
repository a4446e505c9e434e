// A two-axis machine for tests of the pages, bids and workbooks that show a machine: a clamp
// closes, a press makes its stroke (approach, then 20 mm pressing) and returns, the clamp opens.
import { sizeMachine, type MachineDesign } from "~/hydraulics";

/** The axes of the machine worked examples (tests/unit/hydraulics/machine-worked-examples.test.ts). */
export const H = { orientation: "horizontal", mounting: "fixed-pinned", frictionCoefficient: 0.1 } as const;
export const CLAMP = { ...H, name: "Clamp", massKg: 100, processForceN: 10_000, strokeMm: 50, extendSpeedMmS: 50, retractSpeedMmS: 100 };
export const PRESS = {
  ...H,
  name: "Press",
  massKg: 500,
  processForceN: 100_000,
  strokeMm: 200,
  extendSpeedMmS: 100,
  pressStrokeMm: 20,
  pressSpeedMmS: 10,
  retractSpeedMmS: 150,
};
export const FEED = { ...H, name: "Feed", massKg: 300, strokeMm: 500, extendSpeedMmS: 200, retractSpeedMmS: 200 };

export const CLAMP_AND_PRESS = { axes: [CLAMP, PRESS], cyclesPerHour: 120, hoursPerDay: 16, supplyHz: 50, maxPressureBar: 160 } as const;

export const clampAndPress = (): MachineDesign => sizeMachine(CLAMP_AND_PRESS);
