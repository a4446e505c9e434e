import type { RequirementsInput } from "~/hydraulics";

/** A representative mix of axes for the API benchmark: feed, press, lift and tilting deck. */
export const REQUESTS: RequirementsInput[] = [
  { orientation: "horizontal", massKg: 1200, strokeMm: 800, extendSpeedMmS: 150, retractSpeedMmS: 200, mounting: "fixed-fixed", cyclesPerHour: 120, hoursPerDay: 16, supplyHz: 50 },
  { orientation: "vertical", rodDirection: "down", massKg: 800, processForceN: 50_000, strokeMm: 500, extendSpeedMmS: 100, retractSpeedMmS: 150, mounting: "pinned-pinned", cyclesPerHour: 60, hoursPerDay: 16, supplyHz: 50 },
  { orientation: "vertical", rodDirection: "up", massKg: 2500, strokeMm: 1200, extendSpeedMmS: 60, retractSpeedMmS: 80, mounting: "fixed-pinned", cyclesPerHour: 20, hoursPerDay: 8, supplyHz: 60 },
  { orientation: "inclined", inclineDeg: 35, rodDirection: "up", massKg: 4000, strokeMm: 900, extendSpeedMmS: 40, retractSpeedMmS: 50, mounting: "pinned-pinned", cyclesPerHour: 6, hoursPerDay: 10, supplyHz: 50 },
];
