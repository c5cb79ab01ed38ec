import "server-only";
import { and, eq } from "drizzle-orm";
import type { Reader, Tx } from "@/db/client";
import { accountRecipients, shopPeople } from "@/db/queries/recipients";
import { workOrderForMail } from "@/db/queries/work-order-detail";
import { estimateLines, findings } from "@/db/schema";
import { workOrderLabel } from "@/lib/domain";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { lineAmountCents } from "@/lib/money";
import { decisionsMadeMail, estimateReadyMail, lineReopenedMail, type DecisionEvent } from "@/lib/mail/templates/estimate";

/**
 * The estimate's e-mails. Each is queued inside the transaction of the change
 * it reports, reading through that transaction, so what it says is what was
 * committed.
 */
export type WoRef = Awaited<ReturnType<typeof workOrderForMail>>;
/** The facts of a work order an e-mail about it needs; a write that already loaded them passes them instead of an id. */
type WoFacts = Pick<WoRef, "id" | "number" | "accountId" | "createdBy" | "unitNumber">;

const fleetLink = (woId: string) => appUrl(`/fleet/work-orders/${woId}`);
const shopLink = (woId: string) => appUrl(`/work-orders/${woId}`);

/** Decisions on one work order within this long of the first go to each writer as one message. */
export const DECISION_MAIL_WINDOW_MS = 2 * 60_000;

/** The writer who opened the work order (while still an active writer), or every writer when it was someone else. */
export async function writersFor(wo: Pick<WoRef, "createdBy">, db: Reader): Promise<string[]> {
  const writers = await shopPeople(["writer"], db);
  const own = writers.find((w) => w.id === wo.createdBy);
  return own ? [own.email] : writers.map((w) => w.email);
}

/** The approvers' e-mail when lines are sent for decision: what waits, and whether anything was marked Out of service. */
export async function queueEstimateReady(tx: Tx, workOrder: string | (WoFacts & Pick<WoRef, "title"> & { pendingCents: number }), lineCount: number) {
  const wo = typeof workOrder === "string" ? await workOrderForMail(workOrder, tx) : workOrder;
  const [pendingCents, severe] = await Promise.all([
    "pendingCents" in wo
      ? wo.pendingCents
      : tx
          .select({ q: estimateLines.quantityMilli, p: estimateLines.unitPriceCents })
          .from(estimateLines)
          .where(and(eq(estimateLines.workOrderId, wo.id), eq(estimateLines.state, "proposed")))
          .then((waiting) => waiting.reduce((sum, l) => sum + lineAmountCents(l.q, l.p), 0)),
    tx.select({ id: findings.id }).from(findings).where(and(eq(findings.workOrderId, wo.id), eq(findings.severity, "out_of_service"))).limit(1),
  ]);
  const outOfService = severe.length > 0;
  const to = await accountRecipients(wo.accountId, ["approver"], tx);
  const mail = estimateReadyMail({ woLabel: workOrderLabel(wo.number), unitNumber: wo.unitNumber, title: wo.title, lineCount, pendingCents, outOfService, url: fleetLink(wo.id) });
  await queueMail(tx, { to, template: "estimate_ready", mail });
}

export async function queueDecisionMade(tx: Tx, workOrder: string | WoFacts, decision: DecisionEvent) {
  const wo = typeof workOrder === "string" ? await workOrderForMail(workOrder, tx) : workOrder;
  const woLabel = workOrderLabel(wo.number);
  await queueMail(tx, {
    to: await writersFor(wo, tx),
    template: "decision_made",
    group: {
      key: `decision_made:${wo.id}`,
      windowMs: DECISION_MAIL_WINDOW_MS,
      item: decision,
      compose: (decisions) => decisionsMadeMail({ woLabel, unitNumber: wo.unitNumber, decisions, url: shopLink(wo.id) }),
    },
  });
}

export async function queueLineReopened(tx: Tx, workOrderId: string, line: { description: string; approvedCents: number; revisedCents: number; reason: string }) {
  const wo = await workOrderForMail(workOrderId, tx);
  const to = await accountRecipients(wo.accountId, ["approver"], tx);
  const mail = lineReopenedMail({ woLabel: workOrderLabel(wo.number), unitNumber: wo.unitNumber, ...line, url: fleetLink(wo.id) });
  await queueMail(tx, { to, template: "line_reopened", mail });
}
