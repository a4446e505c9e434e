/**
 * Tenderflow sizing engine: pure functions over plain data, no I/O, safe in the browser.
 */
import type { Design } from "./design";
import { parseRequirements } from "./requirements";
import { sizeCircuitParsed } from "./size";

export { ENGINE_VERSION, sizeCircuitParsed } from "./size";
export {
  requirementsSchema, parseRequirements, RequirementsError, FORM_ERROR_KEY,
  REQUIREMENT_LIMITS, REQUIREMENT_DEFAULTS, REQUIREMENT_MESSAGES, ORIENTATIONS, ROD_DIRECTIONS, MOUNTINGS,
  MOUNTING_STYLES, PUMP_TYPES, SUPPLY_FREQUENCIES, NAME_MAX,
  type Requirements, type RequirementsInput,
} from "./requirements";
export type * from "./design";
export { WARNING_CODES, type WarningCode } from "./warnings";
export { NotSizableError } from "./not-sizable";
export { ASSUMPTIONS } from "./assumptions";

/** Validates the requirements (throwing RequirementsError) and sizes the circuit. */
export function sizeCircuit(requirements: unknown): Design {
  return sizeCircuitParsed(parseRequirements(requirements));
}
