import { MACHINE_DUTY_FIELDS, defaultSequence, type MachineMotion } from "~/hydraulics";
import type { UnitSystem } from "~/units";
import { EXAMPLE_AXIS, REQUIREMENT_FIELDS, answerInWords, toFormValues, toRequirementsInput, type FormValues, type RequirementKey } from "./requirement-fields";
import { cycleAnswers, cycleSteps, type Draft } from "./spec-draft";

// A draft of several axes as the machine engine takes it (contract "Machine requirements"), and
// the engine's problems told back in the form's words, each naming its axis.

const DUTY: readonly string[] = MACHINE_DUTY_FIELDS;

/** The machine's cycle from the cycle step: steps of axis motions, by axis name. */
export function machineSequence(draft: Pick<Draft, "axes" | "cycle">): MachineMotion[][] {
  const names = new Map(draft.axes.map((a) => [a.id, a.name.trim()]));
  return cycleSteps(draft.axes, cycleAnswers(draft)).map((step) => step.map((m) => ({ axis: names.get(m.axisId) ?? m.axisId, motion: m.motion })));
}

/** The engine's input for a draft: each axis's own answers with its name, the duty once, the cycle (left out where it is the default). */
export function machineInput(draft: Draft, system: UnitSystem, { withSequence = true } = {}): Record<string, unknown> {
  const axes = draft.axes.map((axis) => {
    const own = toRequirementsInput({ ...axis.mounting, ...axis.motion } as FormValues, system);
    for (const key of DUTY) delete own[key];
    return { name: axis.name.trim(), ...own };
  });
  const duty = Object.fromEntries(Object.entries(toRequirementsInput(draft.duty as FormValues, system)).filter(([k]) => DUTY.includes(k)));
  const sequence = machineSequence(draft);
  const isDefault = JSON.stringify(sequence) === JSON.stringify(defaultSequence(axes.map((a) => a.name)));
  return { axes, ...duty, ...(isDefault || !withSequence ? {} : { sequence }) };
}

const labelOf = (key: string) => (key in REQUIREMENT_FIELDS ? REQUIREMENT_FIELDS[key as RequirementKey].label : key === "name" ? "Name" : key);

/**
 * The engine's field errors (by path: `axes.1.strokeMm`, `sequence.0.1.axis`, `cyclesPerHour`,
 * or a one-axis draft's `strokeMm`) as sentences naming the axis and the question.
 */
export function machineProblems(draft: Pick<Draft, "axes">, fieldErrors: Record<string, string[]>): string[] {
  const problems: string[] = [];
  for (const [path, messages] of Object.entries(fieldErrors)) {
    const parts = path.split(".");
    let where: string;
    if (parts[0] === "axes" && parts.length >= 2) {
      const axis = draft.axes[Number(parts[1])]?.name.trim() || `Axis ${Number(parts[1]) + 1}`;
      where = parts[2] ? `${axis}, ${labelOf(parts[2]).toLowerCase()}` : axis;
    } else if (parts[0] === "sequence") where = "Cycle";
    else if (parts.length === 1 && parts[0] in REQUIREMENT_FIELDS && !DUTY.includes(parts[0]) && draft.axes.length === 1)
      where = `${draft.axes[0].name.trim() || "Axis 1"}, ${labelOf(parts[0]).toLowerCase()}`;
    else where = parts[0] ? labelOf(parts[0]) : "The machine";
    for (const message of messages) problems.push(`${where}: ${message}.`.replace(/\.\.$/, "."));
  }
  return problems;
}

/**
 * The draft with the duty questions not yet answered taken from the example axis, and which
 * those are: the cycle step comes before the duty step, and its preview says what it assumed.
 */
export function withAssumedDuty(draft: Draft, system: UnitSystem): { draft: Draft; assumed: string[] } {
  const example = toFormValues(EXAMPLE_AXIS, system);
  const keys = DUTY.filter((k) => !draft.duty[k]?.trim() && example[k as RequirementKey] !== undefined) as RequirementKey[];
  // "cycles per hour 60", "air temperature around the power unit 25 °C": the label, then the value in words.
  const assumed = keys.map((k) => `${REQUIREMENT_FIELDS[k].label.toLowerCase()} ${answerInWords(k, example[k], system) ?? example[k]}`);
  return { draft: { ...draft, duty: { ...draft.duty, ...Object.fromEntries(keys.map((k) => [k, example[k]!])) } }, assumed };
}

/** The sequence of cycle answers by axis name, for a machine input whose cycle is being chosen. */
export function sequenceOf(axes: readonly { id: string; name: string }[], answers: Record<string, string>): MachineMotion[][] {
  return machineSequence({ axes: axes.map((a) => ({ ...a, mounting: {}, motion: {} })), cycle: answers });
}
