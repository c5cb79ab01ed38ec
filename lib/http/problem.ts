import type { ProblemCode } from "@/lib/api-schema/problem-codes";

/**
 * Errors as RFC 9457 problem documents. Route handlers and server actions throw
 * HttpError; the guard turns it into application/problem+json or a form result.
 */
export interface FieldProblem {
  path: string;
  message: string;
}

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ProblemCode,
    readonly title: string,
    readonly detail: string,
    readonly errors?: FieldProblem[],
    readonly extra?: Record<string, unknown>,
  ) {
    super(detail);
    this.name = "HttpError";
  }
}

export const unauthenticated = () =>
  new HttpError(401, "unauthenticated", "Sign-in required", "Sign in, or send a personal API token as a Bearer token.");

export const forbidden = (detail = "Your role may not do this.") => new HttpError(403, "forbidden", "Not allowed", detail);

export const notFound = (what = "That item") =>
  new HttpError(404, "not_found", "Not found", `${what} was not found.`);

export const invalidInput = (errors: FieldProblem[], detail = "Some values are missing or not valid.") =>
  new HttpError(400, "invalid_input", "Invalid input", detail, errors);

export const conflict = (code: ProblemCode, detail: string, extra?: Record<string, unknown>) =>
  new HttpError(409, code, "Conflict", detail, undefined, extra);

export function problemBody(error: HttpError) {
  return {
    type: `urn:cotter:problem:${error.code}`,
    title: error.title,
    status: error.status,
    detail: error.detail,
    code: error.code,
    ...(error.errors ? { errors: error.errors } : {}),
    ...(error.extra ?? {}),
  };
}

export function problemResponse(error: HttpError, headers?: HeadersInit): Response {
  return new Response(JSON.stringify(problemBody(error)), {
    status: error.status,
    headers: { "content-type": "application/problem+json", ...headers },
  });
}
