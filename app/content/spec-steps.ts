import type { RequirementKey } from "./requirement-fields";

// The steps of the spec form, in order. Names and wording are Tenderflow's own.
export const SPEC_STEPS = [
  { id: "machine", title: "The machine", lead: "What the machine does and how the cylinder sits in it." },
  { id: "motion", title: "Load and motion", lead: "What moves, how far and how fast." },
  { id: "duty", title: "Duty and site", lead: "How hard the axis works and where the power unit stands." },
  { id: "quotation", title: "Quotation", lead: "What you want quoted, by when, and where it goes." },
  { id: "review", title: "Check and publish", lead: "The preliminary circuit and every answer, before shops see it." },
] as const;

export type SpecStepId = (typeof SPEC_STEPS)[number]["id"];
export type FormStepId = Exclude<SpecStepId, "review">;
export const FORM_STEPS = SPEC_STEPS.filter((s) => s.id !== "review").map((s) => s.id) as FormStepId[];

export interface AxisQuestions {
  /** Asked of everyone. */
  keys: RequirementKey[];
  /** Optional refinements behind a disclosure, so the page stays short; blank means the default. */
  more?: { title: string; summary: string; keys: RequirementKey[] };
}

/**
 * The engine's requirement fields, grouped where a buyer thinks of them: the spec form asks
 * each group on its step, the quick-sizing page shows the same groups on one page.
 */
export const AXIS_QUESTIONS: Record<Exclude<FormStepId, "quotation">, AxisQuestions> = {
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

const allKeys = (q: AxisQuestions | undefined) => [...(q?.keys ?? []), ...(q?.more?.keys ?? [])];

/** The engine's requirement fields asked on each step. */
export const ENGINE_KEYS_BY_STEP: Record<FormStepId, RequirementKey[]> = {
  machine: allKeys(AXIS_QUESTIONS.machine),
  motion: allKeys(AXIS_QUESTIONS.motion),
  duty: allKeys(AXIS_QUESTIONS.duty),
  quotation: [],
};

export const isSpecStep = (value: string | undefined): value is SpecStepId => SPEC_STEPS.some((s) => s.id === value);

export function nextStep(step: SpecStepId): SpecStepId | null {
  const i = SPEC_STEPS.findIndex((s) => s.id === step);
  return SPEC_STEPS[i + 1]?.id ?? null;
}

export function previousStep(step: SpecStepId): SpecStepId | null {
  const i = SPEC_STEPS.findIndex((s) => s.id === step);
  return i > 0 ? SPEC_STEPS[i - 1].id : null;
}

/** Where a buyer coming back to a draft resumes: the first step not yet completed. */
export function resumeStep(completed: readonly string[]): SpecStepId {
  return FORM_STEPS.find((s) => !completed.includes(s)) ?? "review";
}
