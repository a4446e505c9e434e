import type { MachineMotion } from "./machine-requirements";

/**
 * The plain tables of a machine's requirements (limits, duty fields) and its default cycle. No
 * zod here, so a page reading them does not carry the schema library; the machine's schema
 * (machine-requirements.ts, with its messages) builds its checks from these.
 */

export const MACHINE_LIMITS = { axes: { min: 1, max: 8 }, steps: { max: 64 } } as const;
export const MOTIONS = ["extend", "retract"] as const;
export type Motion = (typeof MOTIONS)[number];

/** The fields a machine asks once, for its power unit; an axis inside a machine leaves them out. */
export const MACHINE_DUTY_FIELDS = ["cyclesPerHour", "hoursPerDay", "ambientC", "supplyHz", "maxPressureBar", "pumpType"] as const;
export type DutyField = (typeof MACHINE_DUTY_FIELDS)[number];

/** Each axis in order extends, then retracts, one at a time. */
export const defaultSequence = (names: string[]): MachineMotion[][] =>
  names.flatMap((axis) => [[{ axis, motion: "extend" as const }], [{ axis, motion: "retract" as const }]]);
