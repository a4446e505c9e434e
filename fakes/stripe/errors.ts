// Errors in the shape Stripe answers with ({ error: { type, code, message, param } }), so the
// SDK raises the same error classes (StripeInvalidRequestError, StripeCardError, …) as it would
// against Stripe itself.
export type ErrorType = "invalid_request_error" | "card_error" | "idempotency_error" | "api_error";

export class StripeFakeError extends Error {
  constructor(
    readonly status: number,
    readonly type: ErrorType,
    message: string,
    readonly details: { code?: string; param?: string; [more: string]: unknown } = {},
  ) {
    super(message);
  }

  toJSON() {
    return { error: { type: this.type, message: this.message, ...this.details } };
  }
}

export const invalid = (message: string, details: StripeFakeError["details"] = {}) => new StripeFakeError(400, "invalid_request_error", message, details);

export const missingParam = (param: string) => invalid(`Missing required param: ${param}.`, { code: "parameter_missing", param });

export const invalidParam = (param: string, message: string, code = "parameter_invalid_string") => invalid(message, { code, param });

export const noSuch = (label: string, id: string, param = "id") =>
  new StripeFakeError(404, "invalid_request_error", `No such ${label}: '${id}'`, {
    code: "resource_missing",
    param,
  });

export const unauthorized = (message: string) => new StripeFakeError(401, "invalid_request_error", message);
