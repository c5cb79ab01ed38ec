import { eq } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { getDb } from "@/db/client";
import { users } from "@/db/schema";
import { checkApiAnswer } from "@/tests/support/openapi-responses";

export const BASE = "http://localhost:3000";

export async function userByEmail(email: string) {
  const [row] = await getDb().select().from(users).where(eq(users.email, email)).limit(1);
  if (!row) throw new Error(`no demo user ${email}`);
  return row;
}

/** A real next-auth session cookie for a demo user, signed with the test secret. */
export async function sessionCookie(email: string): Promise<string> {
  const user = await userByEmail(email);
  const token = await encode({
    token: { sub: user.id, name: user.name, email: user.email, role: user.role, accountId: user.accountId, sv: user.sessionVersion },
    secret: process.env.NEXTAUTH_SECRET!,
  });
  return `next-auth.session-token=${token}`;
}

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler the way Next.js does, as a signed-in user or as nobody. */
export interface Problem {
  type: string;
  title: string;
  status: number;
  detail: string;
  code: string;
  errors?: { path: string; message: string }[];
}

export async function call<T = Problem>(
  handler: Handler,
  options: { path: string; as?: string | null; method?: string; body?: unknown; params?: Record<string, string>; headers?: Record<string, string> },
): Promise<{ status: number; body: T; headers: Headers }> {
  const headers: Record<string, string> = { ...options.headers };
  if (options.as) headers.cookie = await sessionCookie(options.as);
  let body: string | undefined;
  if (options.body !== undefined) {
    headers["content-type"] ??= "application/json";
    body = typeof options.body === "string" ? options.body : JSON.stringify(options.body);
  }
  const method = options.method ?? (body ? "POST" : "GET");
  const response = await handler(new Request(`${BASE}${options.path}`, { method, headers, body }), {
    params: Promise.resolve(options.params ?? {}),
  });
  const text = await response.text();
  let parsed: unknown = text;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    // not JSON; keep the text
  }
  // Every /api/v1 answer a test sees must be one the OpenAPI document describes.
  checkApiAnswer({ method, url: options.path, status: response.status, contentType: response.headers.get("content-type"), body: parsed });
  return { status: response.status, body: parsed as T, headers: response.headers };
}

/**
 * For tests that call a handler with a Request of their own (binary answers):
 * holds the answer to the document like call() does, and hands it back unread.
 */
export async function checked(request: Request, response: Response | Promise<Response>): Promise<Response> {
  const res = await response;
  const type = res.headers.get("content-type");
  const body: unknown = type?.includes("json") ? await res.clone().json() : null;
  checkApiAnswer({ method: request.method, url: request.url, status: res.status, contentType: type, body });
  return res;
}

/** The SessionUser the guard would build for a demo user (for calling db/queries writes directly). */
export async function sessionUser(email: string): Promise<import("@/lib/auth/session-user").SessionUser> {
  const u = await userByEmail(email);
  return { id: u.id, name: u.name, email: u.email, role: u.role, accountId: u.accountId, signingLimitCents: u.signingLimitCents, via: "session" };
}
