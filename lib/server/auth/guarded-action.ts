import "server-only";
import { unstable_rethrow } from "next/navigation";
import { z } from "zod";
import type { Role } from "@/lib/domain";
import { HttpError } from "@/lib/http/problem";
import { fieldErrorMap } from "@/lib/http/zod-problems";
import { currentUser } from "./current-user";
import type { SessionUser } from "@/lib/auth/session-user";

export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; error: string; code: string; fieldErrors?: Record<string, string>; extra?: Record<string, unknown> };

/** Form data to a plain object; repeated names become arrays. */
export function formDataToObject(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of form.entries()) {
    if (key.startsWith("$ACTION")) continue;
    const existing = out[key];
    if (existing === undefined) out[key] = value;
    else out[key] = Array.isArray(existing) ? [...existing, value] : [existing, value];
  }
  return out;
}

/**
 * The one entry for every server action, the same checks as apiRoute:
 * session, role, zod parse; the body then scopes by account and writes in one
 * transaction. Returns a typed result the form shows; it never throws to the page.
 */
export function guardedAction<S extends z.ZodType, T>(
  options: { roles: readonly Role[]; input: S },
  fn: (ctx: { user: SessionUser; input: z.output<S> }) => Promise<T>,
) {
  return async (raw: z.input<S> | FormData): Promise<ActionResult<T>> =>
    settle(async () => {
      const user = await currentUser();
      if (!user) return { ok: false, code: "unauthenticated", error: "Your session has ended. Sign in again." };
      if (!options.roles.includes(user.role)) {
        return { ok: false, code: "forbidden", error: "Your role may not do this." };
      }
      return parseThen(options.input, raw, (input) => fn({ user, input }));
    });
}

/**
 * The same for the few forms of people who are not signed in (first-run
 * set-up, an invitation, a password reset): zod parse, then the body, whose
 * token or empty database is what authorises it, checked in its transaction.
 */
export function publicAction<S extends z.ZodType, T>(options: { input: S }, fn: (ctx: { input: z.output<S> }) => Promise<T>) {
  return async (raw: z.input<S> | FormData): Promise<ActionResult<T>> =>
    settle(() => parseThen(options.input, raw, (input) => fn({ input })));
}

async function parseThen<S extends z.ZodType, T>(schema: S, raw: unknown, fn: (input: z.output<S>) => Promise<T>): Promise<ActionResult<T>> {
  const parsed = schema.safeParse(raw instanceof FormData ? formDataToObject(raw) : raw);
  if (!parsed.success) {
    return {
      ok: false,
      code: "invalid_input",
      error: "Some values are missing or not valid.",
      fieldErrors: fieldErrorMap(parsed.error),
    };
  }
  return { ok: true, data: await fn(parsed.data) };
}

async function settle<T>(run: () => Promise<ActionResult<T>>): Promise<ActionResult<T>> {
  try {
    return await run();
  } catch (error) {
    // Let redirect() and notFound() from inside an action do their work.
    unstable_rethrow(error);
    if (error instanceof HttpError) {
      const fieldErrors = error.errors ? Object.fromEntries(error.errors.map((e) => [e.path, e.message])) : undefined;
      return { ok: false, code: error.code, error: error.detail, ...(fieldErrors ? { fieldErrors } : {}), ...(error.extra ? { extra: error.extra } : {}) };
    }
    console.error(error);
    return { ok: false, code: "internal_error", error: "Something went wrong. Nothing was changed; try again." };
  }
}
