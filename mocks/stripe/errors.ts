/**
 * The v1 error body `{ error: { type, code?, message, param? } }`. The SDK picks
 * its error class from the status (esm/Error.js `generateV1Error`): 400/404 →
 * StripeInvalidRequestError, 401 → StripeAuthenticationError, 402 → StripeCardError,
 * and `type: "idempotency_error"` → StripeIdempotencyError.
 */
export type ApiErrorType = "invalid_request_error" | "idempotency_error" | "api_error" | "card_error";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ApiErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }

  toBody(): { error: Record<string, string> } {
    const error: Record<string, string> = { type: this.type, message: this.message };
    if (this.code) error.code = this.code;
    if (this.param) error.param = this.param;
    return { error };
  }
}

// Codes and wording follow the public API reference's error codes list (from memory).
export const missingParam = (param: string) =>
  new ApiError(400, "invalid_request_error", `Missing required param: ${param}.`, "parameter_missing", param);

export const unknownParam = (param: string) =>
  new ApiError(
    400,
    "invalid_request_error",
    `Received unknown parameter: ${param} (this local fake supports a subset of the real parameters; see mocks/stripe/README.md)`,
    "parameter_unknown",
    param,
  );

export const invalidInteger = (param: string, value: string) =>
  new ApiError(400, "invalid_request_error", `Invalid integer: ${value}`, "parameter_invalid_integer", param);

export const emptyString = (param: string) =>
  new ApiError(
    400,
    "invalid_request_error",
    `You passed an empty string for '${param}'. We assume empty values are an attempt to unset a parameter; however '${param}' cannot be unset. You should remove '${param}' from your request or supply a non-empty value.`,
    "parameter_invalid_empty",
    param,
  );

export const invalidParam = (param: string, message: string, code?: string) =>
  new ApiError(400, "invalid_request_error", message, code, param);

export const noSuch = (object: string, id: string, param: string) =>
  new ApiError(404, "invalid_request_error", `No such ${object}: '${id}'`, "resource_missing", param);

export const unrecognizedUrl = (method: string, path: string) =>
  new ApiError(404, "invalid_request_error", `Unrecognized request URL (${method}: ${path}).`);
