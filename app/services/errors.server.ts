import { data } from "react-router";

/** An expected failure tied to form fields, shown beside them; nothing was written. */
export class FieldErrors extends Error {
  constructor(public readonly fieldErrors: Record<string, string[]>) {
    super(Object.values(fieldErrors).flat().join(" "));
    this.name = "FieldErrors";
  }
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
