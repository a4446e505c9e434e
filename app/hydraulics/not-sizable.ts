import { RequirementsError } from "./requirements";
import type { Warning } from "./warnings";

/**
 * Valid requirements that nothing in the standard series meets. It is a RequirementsError, so
 * every caller that shows field errors shows this one beside the field that limits the design
 * (an API answers 400 with it, never a 500), and it carries the warning that says why.
 */
export class NotSizableError extends RequirementsError {
  readonly warning: Warning;
  constructor(field: string, warning: Warning) {
    super({ [field]: [warning.message] });
    this.name = "NotSizableError";
    this.message = warning.message;
    this.warning = warning;
  }
}
