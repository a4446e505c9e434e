import { axisNameField, cycleField } from "~/content/spec-draft";
import type { FormValues } from "~/content/requirement-fields";
import { ENGINE_KEYS_BY_STEP, type FormStepKind } from "~/content/spec-steps";

// The spec form's fields as plain data: which names each step posts, their lengths, choices and
// usual answers. No zod here, so the form's page shows its questions without loading the schema
// library; the step schemas (spec.ts) are built over these same names.

/** The longest answer each free-text field takes; every other field holds a number or a choice. */
export const TEXT_MAX = { title: 120, purpose: 2000, deliveryRegion: 80, notes: 4000 } as const;

export const SUPPLY_VOLTAGES = [
  "230 V single-phase",
  "400 V three-phase",
  "415 V three-phase",
  "480 V three-phase",
  "575 V three-phase",
  "690 V three-phase",
] as const;
export const FLUIDS = ["ISO VG 32", "ISO VG 46", "ISO VG 68"] as const;

/** What a fresh step shows before the buyer answers: the usual choice, never a guess about the machine. */
export const STEP_DEFAULTS: Record<string, string> = {
  supplyVoltage: "400 V three-phase",
  fluid: "ISO VG 46",
  unitsWanted: "1",
  currency: "EUR",
  retainerPercent: "20",
};

/** Each step's own (non-engine) fields; the machine step adds a name per axis, the cycle step a step per motion. */
export const OWN_FIELD_NAMES = {
  machine: ["title", "purpose"],
  mounting: [],
  motion: [],
  cycle: [],
  duty: ["supplyVoltage", "fluid"],
  quotation: ["unitsWanted", "dateNeeded", "bidDeadline", "deliveryRegion", "currency", "retainerPercent", "notes"],
} as const satisfies Record<FormStepKind, readonly string[]>;

/**
 * What a step is judged against besides its own answers: the axes (names, for the machine
 * and cycle steps), and the answers the engine needs with this step's to judge it: an axis step's
 * other answers of the same axis and the duty; for the duty step, each axis's answers.
 */
export interface StepContext {
  axes: { id: string; name: string }[];
  /** per axis: the engine answers other than this step's */
  others: FormValues[];
}

/** A step's own field names, given the spec's axes. */
export function ownFieldNames(kind: FormStepKind, axes: StepContext["axes"]): string[] {
  if (kind === "machine") return [...OWN_FIELD_NAMES.machine, ...axes.map((a) => axisNameField(a.id))];
  if (kind === "cycle") return axes.flatMap((a) => [cycleField(a.id, "extend"), cycleField(a.id, "retract")]);
  return [...OWN_FIELD_NAMES[kind]];
}

/** The names a step's form posts: its own fields and the engine fields it asks. */
export function stepFieldNames(kind: FormStepKind, axes: StepContext["axes"] = []): string[] {
  return [...ownFieldNames(kind, axes), ...ENGINE_KEYS_BY_STEP[kind]];
}
