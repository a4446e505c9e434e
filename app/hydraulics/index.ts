/**
 * Tenderflow sizing engine: pure functions over plain data, no I/O, safe in the browser.
 */
import type { Design } from "./design";
import { parseRequirements } from "./requirements";
import { sizeCircuitParsed } from "./size";
import type { MachineDesign } from "./machine-design";
import { sizeMachineParsed } from "./machine";
import { parseMachine } from "./machine-requirements";

export { ENGINE_VERSION, sizeCircuitParsed } from "./size";
export {
  requirementsSchema,
  parseRequirements,
  RequirementsError,
  FORM_ERROR_KEY,
  REQUIREMENT_MESSAGES,
  type Requirements,
  type RequirementsInput,
} from "./requirements";
// The plain tables come from modules without zod, so a page reading only them does not load it.
export * from "./requirement-limits";
export type * from "./design";
export { WARNING_CODES, type WarningCode } from "./warnings";
export { NotSizableError } from "./not-sizable";
export { ASSUMPTIONS } from "./assumptions";
export { sizeMachineParsed } from "./machine";
export { parseMachine, MACHINE_MESSAGES, type MachineRequirements, type MachineRequirementsInput, type MachineMotion } from "./machine-requirements";
export { defaultSequence, MACHINE_LIMITS, MACHINE_DUTY_FIELDS, MOTIONS, type Motion } from "./machine-limits";
export type * from "./machine-design";

/** Validates the requirements (throwing RequirementsError) and sizes the circuit. */
export function sizeCircuit(requirements: unknown): Design {
  return sizeCircuitParsed(parseRequirements(requirements));
}

/** Validates a machine (throwing RequirementsError with paths such as `axes.1.strokeMm`) and sizes it. */
export function sizeMachine(machine: unknown): MachineDesign {
  return sizeMachineParsed(parseMachine(machine));
}
