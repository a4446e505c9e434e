import { z } from "zod";
import { FORM_ERROR_KEY, requirementsSchema, RequirementsError, type Requirements } from "./requirements";
import { defaultSequence, MACHINE_DUTY_FIELDS, MACHINE_LIMITS, MOTIONS, type DutyField, type Motion } from "./machine-limits";

/**
 * The one schema for a machine: one to eight named axes on one power unit, the machine cycle,
 * and the duty asked once for the whole machine. Each axis goes through the axis schema
 * (requirements.ts), so an axis in a machine meets exactly the limits an axis alone meets; the
 * duty fields take their limits from the same schema.
 */

export const MACHINE_MESSAGES = {
  machine: "Send the machine as an object with its axes",
  axes: `Give between ${MACHINE_LIMITS.axes.min} and ${MACHINE_LIMITS.axes.max} axes`,
  axis: "Describe each axis as an object",
  name: "Name each axis of a machine",
  nameTaken: "Another axis already has this name",
  dutyOnce: "Give the duty once for the machine, not for an axis",
  sequence: `Give the cycle as a list of up to ${MACHINE_LIMITS.steps.max} steps, each a list of axes that move together`,
  step: "A step lists at least one axis motion",
  motion: 'Say "extend" or "retract"',
  unknownAxis: "No axis has this name",
  twiceInStep: "This axis already moves in this step",
  neverMoves: "This axis never moves in the cycle",
} as const;

const shape = requirementsSchema.shape;
const motionSchema = z.object(
  {
    axis: z.string({ error: MACHINE_MESSAGES.unknownAxis }).trim().min(1, MACHINE_MESSAGES.unknownAxis),
    motion: z.enum(MOTIONS, { error: MACHINE_MESSAGES.motion }),
  },
  { error: MACHINE_MESSAGES.step },
);

/** The machine's own fields; each axis is checked separately, with the axis schema. */
const machineFields = z.object(
  {
    axes: z
      .array(z.unknown(), { error: MACHINE_MESSAGES.axes })
      .min(MACHINE_LIMITS.axes.min, MACHINE_MESSAGES.axes)
      .max(MACHINE_LIMITS.axes.max, MACHINE_MESSAGES.axes),
    sequence: z
      .array(z.array(motionSchema, { error: MACHINE_MESSAGES.step }).min(1, MACHINE_MESSAGES.step), { error: MACHINE_MESSAGES.sequence })
      .min(1, MACHINE_MESSAGES.sequence)
      .max(MACHINE_LIMITS.steps.max, MACHINE_MESSAGES.sequence)
      .optional(),
    cyclesPerHour: shape.cyclesPerHour,
    hoursPerDay: shape.hoursPerDay,
    ambientC: shape.ambientC,
    supplyHz: shape.supplyHz,
    maxPressureBar: shape.maxPressureBar,
    pumpType: shape.pumpType,
  },
  { error: MACHINE_MESSAGES.machine },
);

export interface MachineMotion {
  axis: string;
  motion: Motion;
}

/** A machine as the engine sees it: every axis carries the machine's duty, so it sizes as an axis alone would. */
export interface MachineRequirements {
  axes: (Requirements & { name: string })[];
  /** the cycle as given, or the default (each axis in order extends, then retracts) */
  sequence: MachineMotion[][];
  /** true when the buyer gave no sequence */
  defaultSequence: boolean;
  cyclesPerHour: number;
  hoursPerDay: number;
  ambientC: number;
  supplyHz: 50 | 60;
  maxPressureBar: number;
  pumpType?: Requirements["pumpType"];
}
export type MachineRequirementsInput = z.input<typeof machineFields> & { axes: Record<string, unknown>[] };

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === "object" && x !== null && !Array.isArray(x);

/**
 * Parses a machine or throws a RequirementsError naming each bad field by its path
 * (`axes.1.strokeMm`, `sequence.0.1.axis`), every problem at once.
 */
export function parseMachine(input: unknown): MachineRequirements {
  const errors: Record<string, string[]> = {};
  const add = (path: (string | number)[], message: string) => {
    const key = path.length > 0 ? path.join(".") : FORM_ERROR_KEY;
    const list = (errors[key] ??= []);
    if (!list.includes(message)) list.push(message);
  };
  const top = machineFields.safeParse(input);
  if (!top.success) for (const issue of top.error.issues) add(issue.path as (string | number)[], issue.message);
  if (!isRecord(input)) throw new RequirementsError(errors);

  // Each axis with the machine's duty, as the axis schema checks it; the duty's own problems are
  // reported once, at the machine's field, so they are left out here.
  const rawAxes = Array.isArray(input.axes) ? input.axes.slice(0, MACHINE_LIMITS.axes.max) : [];
  const duty = Object.fromEntries(MACHINE_DUTY_FIELDS.filter((f) => f in input).map((f) => [f, input[f]]));
  const axes: (Requirements & { name: string })[] = [];
  const names = new Map<string, number>();
  rawAxes.forEach((raw, i) => {
    if (!isRecord(raw)) return add(["axes", i], MACHINE_MESSAGES.axis);
    for (const f of MACHINE_DUTY_FIELDS) if (f in raw) add(["axes", i, f], MACHINE_MESSAGES.dutyOnce);
    const parsed = requirementsSchema.safeParse({ ...raw, ...duty });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = issue.path[0];
        if (!MACHINE_DUTY_FIELDS.includes(field as DutyField)) add(["axes", i, ...(issue.path as (string | number)[])], issue.message);
      }
    }
    const name = typeof raw.name === "string" ? raw.name.trim() : "";
    if (raw.name === undefined || name === "") add(["axes", i, "name"], MACHINE_MESSAGES.name);
    else if (names.has(name)) add(["axes", i, "name"], MACHINE_MESSAGES.nameTaken);
    else names.set(name, i);
    if (parsed.success && name !== "") axes.push({ ...parsed.data, name, decelTimeS: parsed.data.decelTimeS ?? parsed.data.accelTimeS });
  });

  // The cycle names axes that exist, each at most once per step, and moves every axis. Read from
  // the raw steps, so a name is checked even where another field of the cycle is wrong.
  const sequence = top.success ? top.data.sequence : undefined;
  const rawSteps = Array.isArray(input.sequence) ? input.sequence.slice(0, MACHINE_LIMITS.steps.max) : null;
  if (rawSteps) {
    const moved = new Set<string>();
    rawSteps.forEach((step, k) => {
      if (!Array.isArray(step)) return;
      const inStep = new Set<string>();
      step.forEach((m: unknown, j) => {
        if (!isRecord(m) || typeof m.axis !== "string") return;
        const axis = m.axis.trim();
        if (!names.has(axis)) {
          if (axis !== "") add(["sequence", k, j, "axis"], MACHINE_MESSAGES.unknownAxis);
          return;
        }
        if (inStep.has(axis)) add(["sequence", k, j, "axis"], MACHINE_MESSAGES.twiceInStep);
        inStep.add(axis);
        moved.add(axis);
      });
    });
    for (const [name, i] of names) if (!moved.has(name)) add(["axes", i, "name"], MACHINE_MESSAGES.neverMoves);
  }

  if (Object.keys(errors).length > 0 || !top.success) throw new RequirementsError(errors);
  const d = top.data;
  return {
    axes,
    sequence: sequence ?? defaultSequence(axes.map((a) => a.name)),
    defaultSequence: sequence === undefined,
    cyclesPerHour: d.cyclesPerHour,
    hoursPerDay: d.hoursPerDay,
    ambientC: d.ambientC,
    supplyHz: d.supplyHz,
    maxPressureBar: d.maxPressureBar,
    ...(d.pumpType !== undefined ? { pumpType: d.pumpType } : {}),
  };
}
