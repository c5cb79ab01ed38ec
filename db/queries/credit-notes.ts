import { eq, sql } from "drizzle-orm";
import { writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { counters, creditNotes, invoices, type Invoice } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { creditNoteLabel } from "@/lib/domain";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { afterCredit, balanceOf, creditProblem } from "@/lib/invoices/balance";
import { recordAudit } from "./audit";
import { invoiceFor } from "./payments";

/** The next credit-note number, gap-free like invoices; the counter starts at 1 on first use. */
async function nextCreditNoteNumber(tx: Tx): Promise<number> {
  const [row] = await tx
    .insert(counters)
    .values({ name: "credit_note", value: 1 })
    .onConflictDoUpdate({ target: counters.name, set: { value: sql`${counters.value} + 1` } })
    .returning({ value: counters.value });
  if (!row) throw new Error("the credit-note counter returned nothing");
  return row.value;
}

/**
 * Issues a credit note against a live invoice inside the caller's
 * transaction: numbered, never more than the open balance, and settling the
 * invoice when nothing is left owing. The invoice's own lines never change.
 */
export async function creditInvoiceInTx(
  tx: Tx,
  user: SessionUser,
  inv: Invoice,
  credit: { amountCents: number; reason: string; coreLineId?: string | null },
) {
  const problem = creditProblem(inv, credit.amountCents);
  if (problem) throw conflict("credit_refused", problem);
  const number = await nextCreditNoteNumber(tx);
  const at = nowIso();
  const [row] = await tx
    .insert(creditNotes)
    .values({
      number,
      invoiceId: inv.id,
      accountId: inv.accountId,
      amountCents: credit.amountCents,
      reason: credit.reason,
      coreLineId: credit.coreLineId ?? null,
      issuedAt: at,
      issuedBy: user.id,
    })
    .returning({ id: creditNotes.id });
  if (!row) throw new Error("credit note insert returned nothing");
  const after = afterCredit(inv, credit.amountCents);
  await tx.update(invoices).set({ creditedCents: after.creditedCents, status: after.status, updatedAt: at }).where(eq(invoices.id, inv.id));
  await recordAudit(tx, user, {
    action: "invoice.credit",
    entityType: "invoice",
    entityId: inv.id,
    accountId: inv.accountId,
    detail: { creditNote: creditNoteLabel(number), amountCents: credit.amountCents, reason: credit.reason },
  });
  return { id: row.id, number, label: creditNoteLabel(number), invoiceId: inv.id, status: after.status, balanceCents: balanceOf(after) };
}

/** The shop credits part of an issued invoice (owner, writer); another account's invoice is 404. */
export async function issueCreditNote(user: SessionUser, invoiceId: string, input: { amountCents: number; reason: string }, notify?: InSameTx<{ id: string }>) {
  return writeTxThen(async (tx) => creditInvoiceInTx(tx, user, await invoiceFor(tx, user, invoiceId), input), notify);
}
