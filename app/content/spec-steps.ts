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

/** The engine's requirement fields asked on each step. */
export const ENGINE_KEYS_BY_STEP: Record<FormStepId, RequirementKey[]> = {
  machine: ["orientation", "inclineDeg", "rodDirection", "mounting"],
  motion: ["massKg", "processForceN", "frictionCoefficient", "strokeMm", "extendSpeedMmS", "retractSpeedMmS", "accelTimeS"],
  duty: ["cyclesPerHour", "hoursPerDay", "ambientC", "supplyHz", "maxPressureBar"],
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
