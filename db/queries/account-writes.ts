import { and, eq } from "drizzle-orm";
import { writeTx, type Tx } from "@/db/client";
import { accountContacts, accounts, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { accountRuleProblems, type AccountFields, type ContactFields } from "@/lib/validation/account";
import { recordAudit } from "./audit";

type AccountRow = typeof accounts.$inferSelect;
const COLUMNS: (keyof AccountFields)[] = [
  "name", "billingEmail", "address", "phone", "taxExempt", "taxExemptCertificate", "taxRateMilliPct", "poRequired",
  "paymentTermsDays", "fiscalYearStartMonth", "repairBudgetCents", "standingAuthorisationCents", "overrunPercentMilli",
  "overrunFloorCents", "overrunCapCents", "shopSuppliesExempt",
];

async function assertNameFree(tx: Tx, name: string, exceptId?: string) {
  const rows = await tx.select({ id: accounts.id }).from(accounts).where(eq(accounts.name, name)).limit(2);
  if (rows.some((r) => r.id !== exceptId)) throw invalidInput([{ path: "name", message: "Another account already has that name." }]);
}

/** "Contacts: added Ann Lee (fleet manager)" style audit lines: what each list held before and after. */
function contactLabel(c: ContactFields): string {
  return [c.name, c.title && `(${c.title})`, c.email, c.phone, c.isBilling && "billing"].filter(Boolean).join(" ");
}

async function replaceContacts(tx: Tx, accountId: string, contacts: ContactFields[]) {
  const before = await tx.select().from(accountContacts).where(eq(accountContacts.accountId, accountId));
  const from = before.map((c) => contactLabel({ name: c.name, title: c.title, email: c.email, phone: c.phone, isBilling: c.isBilling }));
  const to = contacts.map(contactLabel);
  if (from.join("\n") === to.join("\n")) return null;
  await tx.delete(accountContacts).where(eq(accountContacts.accountId, accountId));
  if (contacts.length) await tx.insert(accountContacts).values(contacts.map((c) => ({ accountId, ...c })));
  return { from: from.join("; "), to: to.join("; ") };
}

/** A new fleet account (and its contacts), audited as created. */
export async function createAccount(user: SessionUser, fields: AccountFields, contacts: ContactFields[] = []) {
  return writeTx(async (tx) => {
    await assertNameFree(tx, fields.name);
    const [row] = await tx.insert(accounts).values(fields).returning();
    if (contacts.length) await tx.insert(accountContacts).values(contacts.map((c) => ({ accountId: row!.id, ...c })));
    await recordAudit(tx, user, {
      action: "account.created",
      entityType: "account",
      entityId: row!.id,
      accountId: row!.id,
      detail: { created: true, ...Object.fromEntries(COLUMNS.map((c) => [c, { from: null, to: fields[c] }])) },
    });
    return row!;
  });
}

/**
 * Changes any of an account's settings, contacts or archived state in one
 * transaction. Rules across fields are checked on the merged result; the audit
 * row lists each changed field's old and new value.
 */
export async function updateAccount(
  user: SessionUser,
  accountId: string,
  change: { fields: Partial<AccountFields>; contacts?: ContactFields[]; archived?: boolean },
  names?: Record<keyof AccountFields, string>,
) {
  return writeTx(async (tx) => {
    const [before] = await tx.select().from(accounts).where(eq(accounts.id, accountId)).limit(1);
    if (!before) throw notFound("That account");
    const merged: AccountFields = { ...pick(before), ...change.fields };
    const problems = accountRuleProblems(merged);
    if (problems.length) throw invalidInput(problems.map((p) => ({ path: names?.[p.column] ?? p.column, message: p.message })));
    if (change.fields.name !== undefined && change.fields.name !== before.name) await assertNameFree(tx, change.fields.name, before.id);

    const changed: Record<string, { from: unknown; to: unknown }> = {};
    for (const c of COLUMNS) if (change.fields[c] !== undefined && before[c] !== merged[c]) changed[c] = { from: before[c], to: merged[c] };
    const archivedAt = change.archived === undefined ? before.archivedAt : change.archived ? (before.archivedAt ?? nowIso()) : null;
    if (archivedAt !== before.archivedAt) changed.archived = { from: before.archivedAt !== null, to: archivedAt !== null };
    const contacts = change.contacts ? await replaceContacts(tx, before.id, change.contacts) : null;
    if (contacts) changed.contacts = contacts;
    if (Object.keys(changed).length === 0) return { changed: 0, account: before };

    const [row] = await tx.update(accounts).set({ ...merged, archivedAt, updatedAt: nowIso() }).where(eq(accounts.id, before.id)).returning();
    await recordAudit(tx, user, { action: "account.settings", entityType: "account", entityId: before.id, accountId: before.id, detail: changed });
    return { changed: Object.keys(changed).length, account: row! };
  });
}

function pick(row: AccountRow): AccountFields {
  return Object.fromEntries(COLUMNS.map((c) => [c, row[c]])) as unknown as AccountFields;
}

/** Sets an approver's signing limit; audited on the approver's account. */
export async function setSigningLimit(user: SessionUser, userId: string, cents: number) {
  return writeTx(async (tx) => {
    const [person] = await tx.select().from(users).where(and(eq(users.id, userId), eq(users.role, "approver"))).limit(1);
    if (!person || !person.accountId) throw notFound("That approver");
    if (person.signingLimitCents === cents) return;
    await tx.update(users).set({ signingLimitCents: cents, updatedAt: nowIso() }).where(eq(users.id, userId));
    await recordAudit(tx, user, {
      action: "account.signing_limit",
      entityType: "account",
      entityId: person.accountId,
      accountId: person.accountId,
      detail: { approver: person.name, signingLimitCents: { from: person.signingLimitCents, to: cents } },
    });
  });
}
