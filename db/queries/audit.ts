import { and, desc, eq } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { auditLog } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { nowIso } from "@/lib/ids";

/** Written inside the same transaction as the change it records. */
export async function recordAudit(
  tx: Tx,
  actor: Pick<SessionUser, "id" | "name" | "role"> | { label: string },
  entry: { action: string; entityType: string; entityId: string; accountId?: string | null; detail?: unknown },
): Promise<void> {
  await tx.insert(auditLog).values({
    at: nowIso(),
    actorUserId: "id" in actor ? actor.id : null,
    actorLabel: "id" in actor ? `${actor.name} (${actor.role})` : actor.label,
    action: entry.action,
    entityType: entry.entityType,
    entityId: entry.entityId,
    accountId: entry.accountId ?? null,
    detail: entry.detail ?? null,
  });
}

/** The latest audited changes of one thing, newest first (shop pages only). */
export async function auditTrail(entityType: string, entityId: string, limit = 30) {
  return getDb()
    .select({ id: auditLog.id, at: auditLog.at, actor: auditLog.actorLabel, action: auditLog.action, detail: auditLog.detail })
    .from(auditLog)
    .where(and(eq(auditLog.entityType, entityType), eq(auditLog.entityId, entityId)))
    .orderBy(desc(auditLog.at))
    .limit(limit);
}
