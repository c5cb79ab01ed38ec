import { and, asc, eq, isNull } from "drizzle-orm";
import { getDb, writeTx, writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { accounts, invitations, users, type Invitation } from "@/db/schema";
import { linkState, invitationExpiry } from "@/lib/auth/link-policy";
import { hashPassword } from "@/lib/auth/password";
import type { SessionUser } from "@/lib/auth/session-user";
import { generateLinkToken, sha256Hex } from "@/lib/auth/tokens";
import { isShopRole } from "@/lib/domain";
import { HttpError, conflict, forbidden, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import type { InvitationInput } from "@/lib/validation/people";
import { recordAudit } from "./audit";

/** What a caller may see of an invitation (never its token hash). */
const publicColumns = {
  id: invitations.id,
  email: invitations.email,
  name: invitations.name,
  role: invitations.role,
  accountId: invitations.accountId,
  signingLimitCents: invitations.signingLimitCents,
  expiresAt: invitations.expiresAt,
  sentAt: invitations.sentAt,
  acceptedAt: invitations.acceptedAt,
  withdrawnAt: invitations.withdrawnAt,
};

/** The owner invites anyone; a service writer invites a fleet account's people only. */
function assertMayInvite(user: SessionUser, role: Invitation["role"]) {
  if (user.role === "owner") return;
  if (user.role === "writer" && !isShopRole(role)) return;
  throw forbidden("Only the owner invites shop staff.");
}

async function checkAccount(tx: Tx, accountId: string | undefined) {
  if (!accountId) return;
  const [account] = await tx.select({ id: accounts.id, archivedAt: accounts.archivedAt }).from(accounts).where(eq(accounts.id, accountId)).limit(1);
  if (!account) throw invalidInput([{ path: "accountId", message: "That account does not exist." }]);
  if (account.archivedAt) throw invalidInput([{ path: "accountId", message: "That account is archived; bring it back before inviting its people." }]);
}

type Sent = { invitation: { id: string; email: string; name: string; role: Invitation["role"]; accountId: string | null; expiresAt: string }; token: string };

/** Creates an invitation; its link token is handed to `notify` (to queue the e-mail in this transaction), never stored. */
export async function createInvitation(user: SessionUser, input: InvitationInput, notify?: InSameTx<Sent>) {
  assertMayInvite(user, input.role);
  const { token, hash } = generateLinkToken();
  return writeTxThen(async (tx) => {
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1);
    if (taken) throw invalidInput([{ path: "email", message: "Someone already signs in with that e-mail." }]);
    const [pending] = await tx
      .select({ id: invitations.id })
      .from(invitations)
      .where(and(eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.withdrawnAt)))
      .limit(1);
    if (pending) {
      throw conflict("already_invited", `${input.email} already has an invitation waiting. Re-send it, or withdraw it first.`, { invitationId: pending.id });
    }
    await checkAccount(tx, input.accountId);
    const now = new Date();
    const [row] = await tx
      .insert(invitations)
      .values({
        email: input.email,
        name: input.name,
        role: input.role,
        accountId: isShopRole(input.role) ? null : (input.accountId ?? null),
        signingLimitCents: input.role === "approver" ? (input.signingLimitCents ?? 0) : null,
        tokenHash: hash,
        expiresAt: invitationExpiry(now),
        sentAt: now.toISOString(),
        invitedBy: user.id,
      })
      .returning(publicColumns);
    await recordAudit(tx, user, {
      action: "invitation.sent",
      entityType: "invitation",
      entityId: row!.id,
      accountId: row!.accountId,
      detail: { email: input.email, role: input.role },
    });
    return { invitation: row!, token };
  }, notify);
}

async function liveInvitation(tx: Tx, user: SessionUser, id: string) {
  const [row] = await tx.select().from(invitations).where(eq(invitations.id, id)).limit(1);
  if (!row) throw notFound("That invitation");
  assertMayInvite(user, row.role);
  if (row.acceptedAt) throw conflict("invitation_used", `${row.email} has already accepted this invitation and signs in with their own password.`);
  if (row.withdrawnAt) throw conflict("invitation_withdrawn", "This invitation was withdrawn. Invite the person again.");
  return row;
}

/** A new link (the old one stops working) and a new week. */
export async function resendInvitation(user: SessionUser, id: string, notify?: InSameTx<Sent>) {
  const { token, hash } = generateLinkToken();
  return writeTxThen(async (tx) => {
    const row = await liveInvitation(tx, user, id);
    const now = new Date();
    const [updated] = await tx
      .update(invitations)
      .set({ tokenHash: hash, expiresAt: invitationExpiry(now), sentAt: now.toISOString() })
      .where(eq(invitations.id, row.id))
      .returning(publicColumns);
    await recordAudit(tx, user, { action: "invitation.resent", entityType: "invitation", entityId: row.id, accountId: row.accountId, detail: { email: row.email } });
    return { invitation: updated!, token };
  }, notify);
}

export async function withdrawInvitation(user: SessionUser, id: string) {
  return writeTx(async (tx) => {
    const row = await liveInvitation(tx, user, id);
    const [updated] = await tx.update(invitations).set({ withdrawnAt: nowIso() }).where(eq(invitations.id, row.id)).returning(publicColumns);
    await recordAudit(tx, user, { action: "invitation.withdrawn", entityType: "invitation", entityId: row.id, accountId: row.accountId, detail: { email: row.email } });
    return updated!;
  });
}

/** Invitations not yet accepted or withdrawn (expired ones included, to re-send), optionally of one account. */
export async function pendingInvitations(accountId?: string) {
  return getDb()
    .select({ ...publicColumns, accountName: accounts.name })
    .from(invitations)
    .leftJoin(accounts, eq(accounts.id, invitations.accountId))
    .where(and(isNull(invitations.acceptedAt), isNull(invitations.withdrawnAt), accountId ? eq(invitations.accountId, accountId) : undefined))
    .orderBy(asc(invitations.sentAt));
}

/** Who a link invites, for the page that opens from it. Looked up by the token's hash only. */
export async function invitationForToken(token: string) {
  const [row] = await getDb()
    .select({ ...publicColumns, accountName: accounts.name })
    .from(invitations)
    .leftJoin(accounts, eq(accounts.id, invitations.accountId))
    .where(eq(invitations.tokenHash, sha256Hex(token)))
    .limit(1);
  if (!row) return null;
  return { ...row, state: linkState({ expiresAt: row.expiresAt, usedAt: row.acceptedAt, withdrawnAt: row.withdrawnAt }, new Date()) };
}

export function refusalFor(state: "used" | "expired" | "withdrawn"): HttpError {
  if (state === "used") return conflict("invitation_used", "This invitation has already been used. Sign in with the password you chose, or use “Forgot your password?”.");
  if (state === "withdrawn") return new HttpError(410, "invitation_withdrawn", "Invitation withdrawn", "This invitation was withdrawn. Ask whoever invited you for a new one.");
  return new HttpError(410, "invitation_expired", "Invitation expired", "This invitation has expired. Ask whoever invited you to send it again.");
}

/**
 * The person sets their own password: the invitation becomes their user row,
 * in one transaction that also marks it used, so a link works exactly once.
 */
export async function acceptInvitation(token: string, password: string) {
  const passwordHash = await hashPassword(password);
  return writeTx(async (tx) => {
    const [row] = await tx.select().from(invitations).where(eq(invitations.tokenHash, sha256Hex(token))).limit(1);
    if (!row) throw new HttpError(404, "invitation_not_found", "Not found", "This link is not valid. If you were sent a newer invitation, use the link in that one.");
    const state = linkState({ expiresAt: row.expiresAt, usedAt: row.acceptedAt, withdrawnAt: row.withdrawnAt }, new Date());
    if (state !== "usable") throw refusalFor(state);
    const [taken] = await tx.select({ id: users.id }).from(users).where(eq(users.email, row.email)).limit(1);
    if (taken) throw refusalFor("used");
    const [user] = await tx
      .insert(users)
      .values({ email: row.email, name: row.name, role: row.role, accountId: row.accountId, signingLimitCents: row.signingLimitCents, passwordHash })
      .returning({ id: users.id, email: users.email, name: users.name, role: users.role, accountId: users.accountId });
    await tx.update(invitations).set({ acceptedAt: nowIso(), acceptedUserId: user!.id }).where(eq(invitations.id, row.id));
    await recordAudit(tx, { id: user!.id, name: user!.name, role: user!.role }, {
      action: "invitation.accepted",
      entityType: "user",
      entityId: user!.id,
      accountId: row.accountId,
      detail: { email: row.email, role: row.role },
    });
    return user!;
  });
}
