// The engine's machine sizing for the browser, loaded by a dynamic import (use-machine-sizing.ts).
// It names the engine's own modules rather than its index, which the pages import statically for
// its tables and schemas: through the index, the whole engine would ride in every page's script.
import { sizeMachineParsed } from "~/hydraulics/machine";
import { parseMachine } from "~/hydraulics/machine-requirements";

export { NotSizableError } from "~/hydraulics/not-sizable";
export { RequirementsError } from "~/hydraulics/requirements";

export const sizeMachine = (machine: unknown) => sizeMachineParsed(parseMachine(machine));
