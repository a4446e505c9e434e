import type { RequirementKey } from "./requirement-fields";
import { AXIS_STEP_KINDS, axisStepId, type AxisStepKind } from "./spec-draft";

// The steps of the spec form, in order. Names and wording are Tenderflow's own. The machine is
// described once (title, its axes), then each axis on two steps of its own (mounting, motion),
// then the cycle (with two axes or more), the duty and site, the quotation, and the review.

export type StepKind = "machine" | AxisStepKind | "cycle" | "duty" | "quotation" | "review";
export type FormStepKind = Exclude<StepKind, "review">;
/** The steps every machine has once. */
export type SharedStepId = Exclude<StepKind, AxisStepKind>;

const SHARED: Record<SharedStepId, { title: string; lead: string }> = {
  machine: { title: "The machine", lead: "What the machine does, and the axes (cylinders) it moves." },
  cycle: { title: "Cycle", lead: "In which order the axes move, and which move together." },
  duty: { title: "Duty and site", lead: "How hard the machine works and where the power unit stands." },
  quotation: { title: "Quotation", lead: "What you want quoted, by when, and where it goes." },
  review: { title: "Check and publish", lead: "The preliminary circuit and every answer, before shops see it." },
};
const AXIS_STEP_TEXT: Record<AxisStepKind, { title: string; lead: (axis: string) => string }> = {
  mounting: { title: "Mounting", lead: (axis) => `How the cylinder of “${axis}” sits in the machine.` },
  motion: { title: "Load and motion", lead: (axis) => `What “${axis}” moves, how far and how fast.` },
};

export interface StepRef {
  id: string;
  kind: StepKind;
  title: string;
  lead: string;
  /** the axis an axis step asks about */
  axis?: { id: string; name: string };
}

/** Every step of a draft with these axes, in order, ending with the review. */
export function specSteps(axes: readonly { id: string; name: string }[]): StepRef[] {
  const shared = (kind: SharedStepId): StepRef => ({ id: kind, kind, ...SHARED[kind] });
  return [
    shared("machine"),
    ...axes.flatMap((axis) =>
      AXIS_STEP_KINDS.map((kind) => ({
        id: axisStepId(axis.id, kind),
        kind,
        title: AXIS_STEP_TEXT[kind].title,
        lead: AXIS_STEP_TEXT[kind].lead(axis.name),
        axis,
      })),
    ),
    ...(axes.length > 1 ? [shared("cycle")] : []),
    shared("duty"),
    shared("quotation"),
    shared("review"),
  ];
}

export const findStep = (steps: readonly StepRef[], id: string | undefined) => steps.find((s) => s.id === id) ?? null;

export function nextStep(steps: readonly StepRef[], id: string): string | null {
  const i = steps.findIndex((s) => s.id === id);
  return i >= 0 ? (steps[i + 1]?.id ?? null) : null;
}

export function previousStep(steps: readonly StepRef[], id: string): string | null {
  const i = steps.findIndex((s) => s.id === id);
  return i > 0 ? steps[i - 1].id : null;
}

/** Where a buyer coming back to a draft resumes: the first step not yet completed. */
export function resumeStep(steps: readonly StepRef[], completed: readonly string[]): string {
  return steps.find((s) => s.kind !== "review" && !completed.includes(s.id))?.id ?? "review";
}

export interface AxisQuestions {
  /** Asked of everyone. */
  keys: RequirementKey[];
  /** Optional refinements behind a disclosure, so the page stays short; blank means the default. */
  more?: { title: string; summary: string; keys: RequirementKey[] };
}

/**
 * The engine's requirement fields, grouped where a buyer thinks of one axis: the quick-sizing
 * page shows these groups on one page.
 */
export const AXIS_QUESTIONS: Record<"machine" | "motion" | "duty", AxisQuestions> = {
  machine: {
    keys: ["orientation", "inclineDeg", "rodDirection", "mounting"],
    more: { title: "More about the mounting", summary: "Where the cylinder body is fixed", keys: ["mountingStyle"] },
  },
  motion: {
    keys: ["massKg", "processForceN", "frictionCoefficient", "strokeMm", "extendSpeedMmS", "retractSpeedMmS", "accelTimeS"],
    more: {
      title: "More about the motion",
      summary: "A slow pressing stroke, a dwell at force, the time to stop",
      keys: ["pressStrokeMm", "pressSpeedMmS", "dwellS", "decelTimeS"],
    },
  },
  duty: {
    keys: ["cyclesPerHour", "hoursPerDay", "holdMinutes", "ambientC", "supplyHz", "maxPressureBar"],
    more: { title: "Pump choice", summary: "Choose the pump yourself, or let the sizing choose", keys: ["pumpType"] },
  },
};

/**
 * The spec form's questions by step: an axis's own on its mounting and motion steps (how long
 * it holds its load is the axis's own, so it moves to the motion step), the power unit's once
 * on the duty step.
 */
export const FORM_QUESTIONS: Record<"mounting" | "motion" | "duty", AxisQuestions> = {
  mounting: AXIS_QUESTIONS.machine,
  motion: { ...AXIS_QUESTIONS.motion, keys: [...AXIS_QUESTIONS.motion.keys, "holdMinutes"] },
  duty: { ...AXIS_QUESTIONS.duty, keys: AXIS_QUESTIONS.duty.keys.filter((k) => k !== "holdMinutes") },
};

const allKeys = (q: AxisQuestions | undefined) => [...(q?.keys ?? []), ...(q?.more?.keys ?? [])];

/** The engine's requirement fields asked on each kind of step. */
export const ENGINE_KEYS_BY_STEP: Record<FormStepKind, RequirementKey[]> = {
  machine: [],
  mounting: allKeys(FORM_QUESTIONS.mounting),
  motion: allKeys(FORM_QUESTIONS.motion),
  cycle: [],
  duty: allKeys(FORM_QUESTIONS.duty),
  quotation: [],
};

/** The kinds of form step in the order a spec asks them (e.g. to list answers in that order). */
export const FORM_STEPS: FormStepKind[] = ["machine", "mounting", "motion", "cycle", "duty", "quotation"];
