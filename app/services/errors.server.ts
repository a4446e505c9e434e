import type { SubmissionResult } from "@conform-to/react";
import { data } from "react-router";

/** An expected failure tied to form fields, shown beside them; nothing was written. */
export class FieldErrors extends Error {
  constructor(public readonly fieldErrors: Record<string, string[]>) {
    super(Object.values(fieldErrors).flat().join(" "));
    this.name = "FieldErrors";
  }
}

/** The FieldErrors a service threw; anything else (a 404, a 403, a crash) is thrown on. */
export function fieldErrorsOf(error: unknown): FieldErrors {
  if (error instanceof FieldErrors) return error;
  throw error;
}

interface Replying {
  reply(options?: { formErrors?: string[]; fieldErrors?: Record<string, string[]>; hideFields?: string[] }): SubmissionResult<string[]>;
}

/**
 * The one way a route turns a service's FieldErrors into its form's reply: field messages beside
 * their fields, the "" key above the form (`asFormErrors` puts every message there, for forms
 * whose fields are not the service's). Anything that is not a FieldErrors is thrown on.
 */
export function fieldErrorReply(submission: Replying, error: unknown, options: { hideFields?: string[]; asFormErrors?: boolean } = {}) {
  const { "": formErrors = [], ...fieldErrors } = fieldErrorsOf(error).fieldErrors;
  if (options.asFormErrors) return submission.reply({ formErrors: [...formErrors, ...Object.values(fieldErrors).flat()], hideFields: options.hideFields });
  return submission.reply({ formErrors, fieldErrors, hideFields: options.hideFields });
}

/** Throws a 404 response: used for missing records and for other organisations' records alike. */
export function notFound(message = "Not found"): never {
  throw data({ message }, { status: 404 });
}

export function forbidden(message = "You don't have access to this page."): never {
  throw data({ message }, { status: 403 });
}

export function invariantResponse(condition: unknown, message = "Not found", status = 404): asserts condition {
  if (!condition) throw data({ message }, { status });
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An id from a URL or form: a malformed one is as "not found" as a missing record. */
export function requireId(value: string | undefined): string {
  if (!value || !UUID.test(value)) notFound();
  return value;
}
