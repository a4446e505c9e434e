import { MACHINE_DUTY_FIELDS, MACHINE_LIMITS } from "~/hydraulics";
import { typedToRequirementsInput, type TypedAnswers } from "./requirement-fields";

// Quick sizing of a machine: the axes a visitor adds, as the machine engine takes them, and the
// engine's problems (by path, `axes.1.strokeMm`) told back beside each axis's own field.

export const MAX_AXES = MACHINE_LIMITS.axes.max;
const DUTY: ReadonlySet<string> = new Set(MACHINE_DUTY_FIELDS);

/** A field asked once for the machine's power unit rather than of each axis. */
export const isMachineDuty = (key: string) => DUTY.has(key);

export interface QuickAxis {
  /** stable across renames and removals, for React's keys */
  key: number;
  name: string;
  typed: TypedAnswers;
}

/** The machine engine's input: each axis's own answers with its name, the duty once from `duty`. */
export function quickMachineInput(axes: readonly QuickAxis[], duty: TypedAnswers): Record<string, unknown> {
  const own = axes.map((a) => {
    const input = typedToRequirementsInput(a.typed);
    for (const key of DUTY) delete input[key];
    return { name: a.name.trim(), ...input };
  });
  const shared = Object.entries(typedToRequirementsInput(duty)).filter(([key]) => DUTY.has(key));
  return { axes: own, ...Object.fromEntries(shared) };
}

/** A name no axis has yet: "Axis 2", "Axis 3", … */
export function nextAxisName(axes: readonly Pick<QuickAxis, "name">[]): string {
  const taken = new Set(axes.map((a) => a.name.trim().toLowerCase()));
  for (let n = axes.length + 1; ; n++) if (!taken.has(`axis ${n}`)) return `Axis ${n}`;
}

export interface MachineErrors {
  /** each axis's problems by its field (`name` for its name, `_form` for the axis as a whole) */
  axes: Record<string, string[]>[];
  /** the machine's own: its duty fields, and `_form` for anything else */
  machine: Record<string, string[]>;
}

/** The engine's field errors split by where the form shows them. */
export function splitMachineErrors(fieldErrors: Record<string, string[]>, count: number): MachineErrors {
  const result: MachineErrors = { axes: Array.from({ length: count }, () => ({})), machine: {} };
  const add = (into: Record<string, string[]>, key: string, messages: string[]) => (into[key] = [...(into[key] ?? []), ...messages]);
  for (const [path, messages] of Object.entries(fieldErrors)) {
    const [head, index, field] = path.split(".");
    const axis = head === "axes" && index !== undefined ? result.axes[Number(index)] : undefined;
    if (axis) add(axis, field ?? "_form", messages);
    else if (DUTY.has(head)) add(result.machine, head, messages);
    else add(result.machine, "_form", messages);
  }
  return result;
}
