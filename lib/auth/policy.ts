import { isShopRole, type Role } from "@/lib/domain";
import type { SessionUser } from "./session-user";

/** Who may do what. The guard checks these; the UI only hides what they refuse. */
export const CAN = {
  manageShop: ["owner"],
  writeEstimates: ["owner", "writer"],
  manageAccounts: ["owner", "writer"],
  moveStatus: ["owner", "writer", "tech"],
  postFindings: ["owner", "writer", "tech"],
  clockTime: ["owner", "writer", "tech"],
  decide: ["approver"],
  pay: ["clerk", "approver"],
  readStatement: ["owner", "writer", "clerk", "approver"],
  /** The fleet portal's own statement page: its account's people who see money. */
  readOwnStatement: ["clerk", "approver"],
  issueInvoices: ["owner", "writer"],
  enterPoNumber: ["owner", "writer", "clerk", "approver"],
  logOccurrence: ["owner", "writer", "tech", "approver", "clerk", "viewer"],
  anyone: ["owner", "writer", "tech", "approver", "clerk", "viewer"],
  shopStaff: ["owner", "writer", "tech"],
  fleet: ["approver", "clerk", "viewer"],
} as const satisfies Record<string, readonly Role[]>;

export function hasRole(user: Pick<SessionUser, "role">, roles: readonly Role[]): boolean {
  return roles.includes(user.role);
}

export function isStaff(user: Pick<SessionUser, "role">): boolean {
  return isShopRole(user.role);
}

/**
 * The account a query must be limited to: the user's own for fleet people,
 * null (every account) for shop staff. Queries put this in their WHERE clause.
 */
export function accountScope(user: Pick<SessionUser, "role" | "accountId">): string | null {
  if (isShopRole(user.role)) return null;
  // A fleet user without an account sees nothing rather than everything.
  return user.accountId ?? "__no_account__";
}
