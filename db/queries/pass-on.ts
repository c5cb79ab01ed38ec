import { and, eq, gt, ne } from "drizzle-orm";
import { getDb, writeTxThen, type InSameTx } from "@/db/client";
import { statusEvents, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { conflict, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { formatCents, lineAmountCents } from "@/lib/money";
import { recordAudit } from "./audit";
import { loadEstimateContext } from "./estimate-context";

/** The caller's colleagues on their own account who may sign for more: active approvers with a higher limit. */
export async function higherLimitApprovers(user: SessionUser) {
  if (user.role !== "approver" || !user.accountId) return [];
  return getDb()
    .select({ id: users.id, name: users.name, signingLimitCents: users.signingLimitCents })
    .from(users)
    .where(
      and(
        eq(users.accountId, user.accountId),
        eq(users.role, "approver"),
        eq(users.active, true),
        ne(users.id, user.id),
        gt(users.signingLimitCents, user.signingLimitCents ?? 0),
      ),
    )
    .orderBy(users.signingLimitCents);
}

/**
 * Passes lines waiting on a decision to a named colleague with a higher signing limit. Nothing is
 * decided: the lines stay waiting, the timeline says who passed what to whom, and the colleague
 * gets an e-mail linking to them. The server's limits are untouched.
 */
export type PassedOn = { workOrderId: string; from: string; to: { name: string; email: string }; lines: { id: string; description: string; amountCents: number }[]; note: string };

export async function passLinesOn(
  user: SessionUser,
  input: { workOrderId: string; toUserId: string; lineIds: string[]; note: string },
  notify?: InSameTx<PassedOn>,
): Promise<PassedOn> {
  return writeTxThen(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, input.workOrderId);
    if (ctx.wo.status === "released") throw conflict("work_order_closed", "This visit is released: nothing on it waits for a decision.");
    const [colleague] = await tx
      .select({ id: users.id, name: users.name, email: users.email, signingLimitCents: users.signingLimitCents })
      .from(users)
      .where(and(eq(users.id, input.toUserId), eq(users.accountId, ctx.wo.accountId), eq(users.role, "approver"), eq(users.active, true)))
      .limit(1);
    if (!colleague || colleague.id === user.id) throw notFound("That approver");
    if ((colleague.signingLimitCents ?? 0) <= (user.signingLimitCents ?? 0)) {
      throw conflict("not_higher_limit", `${colleague.name}'s signing limit is not higher than yours, so passing the lines on would not help.`);
    }
    const lines = ctx.lines.filter((l) => input.lineIds.includes(l.id));
    if (lines.length !== new Set(input.lineIds).size) throw notFound("One of those lines");
    const decided = lines.find((l) => l.state !== "proposed");
    if (decided) throw conflict("not_pending", `“${decided.description}” is not waiting for a decision any more.`);
    const passed = lines.map((l) => ({ id: l.id, description: l.description, amountCents: lineAmountCents(l.quantityMilli, l.unitPriceCents) }));
    const total = passed.reduce((s, l) => s + l.amountCents, 0);
    const at = nowIso();
    await tx.insert(statusEvents).values({
      workOrderId: ctx.wo.id,
      status: ctx.wo.status,
      note: `${user.name} passed ${passed.length} line${passed.length === 1 ? "" : "s"} (${formatCents(total)}) to ${colleague.name}, who has a higher signing limit.`,
      byUserId: user.id,
      at,
    });
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, ctx.wo.id));
    await recordAudit(tx, user, {
      action: "estimate.passed_on",
      entityType: "work_order",
      entityId: ctx.wo.id,
      accountId: ctx.wo.accountId,
      detail: { toUserId: colleague.id, lineIds: passed.map((l) => l.id), note: input.note },
    });
    return { workOrderId: ctx.wo.id, from: user.name, to: { name: colleague.name, email: colleague.email }, lines: passed, note: input.note };
  }, notify);
}

