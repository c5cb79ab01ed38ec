import "server-only";
import { z } from "zod";
import { userFromRequest } from "@/lib/server/auth/resolve-user";
import type { SessionUser } from "@/lib/auth/session-user";
import type { Role } from "@/lib/domain";
import { HttpError, forbidden, invalidInput, notFound, problemResponse, unauthenticated } from "@/lib/http/problem";
import { DEFAULT_MAX_BODY_BYTES, readJsonBody } from "./read-body";
import { fieldProblems } from "@/lib/http/zod-problems";

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

interface RouteOptions<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType> {
  roles: readonly Role[];
  params?: P;
  query?: Q;
  body?: B;
  maxBodyBytes?: number;
}

export interface RouteInput<P, Q, B> {
  user: SessionUser;
  params: P;
  query: Q;
  body: B;
  request: Request;
}

const empty = z.object({});

/**
 * The one entry for every API route handler: who is asking (401), may their
 * role do this (403), are the inputs well formed (400/404/413/415), then the
 * handler, which scopes its queries by account and writes in one transaction.
 * Anything thrown becomes an RFC 9457 problem document; nothing leaks as a 500
 * page.
 */
export function apiRoute<
  P extends z.ZodType = typeof empty,
  Q extends z.ZodType = typeof empty,
  B extends z.ZodType = typeof empty,
>(
  options: RouteOptions<P, Q, B>,
  handler: (input: RouteInput<z.output<P>, z.output<Q>, z.output<B>>) => Promise<Response | object>,
) {
  return async (request: Request, context?: RouteContext): Promise<Response> => {
    try {
      const user = await userFromRequest(request);
      if (!user) throw unauthenticated();
      if (!options.roles.includes(user.role)) throw forbidden();
      const input = await parseRouteInput(options, request, context);
      const result = await handler({ user, ...input, request });
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Params (a malformed id is a 404), query (400) and JSON body (400/413/415), each through its zod schema. */
async function parseRouteInput<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType>(
  options: Omit<RouteOptions<P, Q, B>, "roles">,
  request: Request,
  context?: RouteContext,
): Promise<{ params: z.output<P>; query: z.output<Q>; body: z.output<B> }> {
  const rawParams = (await context?.params) ?? {};
  const params = (options.params ?? empty).safeParse(rawParams);
  // A malformed id names nothing that exists.
  if (!params.success) throw notFound();

  const url = new URL(request.url);
  const query = (options.query ?? empty).safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) throw invalidInput(fieldProblems(query.error), "Some query parameters are not valid.");

  let body: unknown = {};
  if (options.body) {
    const raw = await readJsonBody(request, options.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES);
    const parsed = options.body.safeParse(raw);
    if (!parsed.success) throw invalidInput(fieldProblems(parsed.error));
    body = parsed.data;
  }
  return { params: params.data as z.output<P>, query: query.data as z.output<Q>, body: body as z.output<B> };
}

/**
 * The entry for the few routes that answer people who are not signed in (the
 * first-run set-up, accepting an invitation, a password reset): the same input
 * checks and problem documents as apiRoute, no session. The token or the empty
 * database is what authorises them, and the handler checks it in its transaction.
 */
export function publicRoute<P extends z.ZodType = typeof empty, B extends z.ZodType = typeof empty>(
  options: { params?: P; body?: B; maxBodyBytes?: number },
  handler: (input: { params: z.output<P>; body: z.output<B>; request: Request }) => Promise<Response | object>,
) {
  return async (request: Request, context?: RouteContext): Promise<Response> => {
    try {
      const { params, body } = await parseRouteInput(options, request, context);
      const result = await handler({ params, body, request });
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

export function errorResponse(error: unknown): Response {
  if (error instanceof HttpError) return problemResponse(error);
  console.error(error);
  return problemResponse(
    new HttpError(500, "internal_error", "Something went wrong", "The server could not finish this request. Nothing was changed."),
  );
}

// Kept here too, where every route imports it from; defined with the other route inputs.
export { idParams } from "@/lib/validation/api-queries";
