import "server-only";
import { forbidden } from "next/navigation";
import type { Role } from "@/lib/domain";
import { requireUser } from "./current-user";
import { hasRole } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";

/**
 * The first call of every page: who is asking (401 → sign in), and may their
 * role see this page (403, nothing else rendered). A page then loads its
 * record scoped to the caller and calls notFound() when the load is empty, so
 * another account's id is a 404 exactly like an id that does not exist.
 * The layout's own check is not enough: Next renders a page beside its
 * layout, so the page must refuse before it reads anything.
 */
export async function requirePageRole(roles: readonly Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!hasRole(user, roles)) forbidden();
  return user;
}
