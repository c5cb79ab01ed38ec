import { and, eq, inArray, isNotNull, like } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { openDatabase } from "@/db/client";
import { accounts, concerns, estimateLines, findings, invitations, invoices, occurrences, photos, units, users, workOrders } from "@/db/schema";
import { invoiceLabel, workOrderLabel, type Role } from "@/lib/domain";

export const PARAM_MAP_FILE = "tests/browser/sweep/fixture.ts (paramValues)";

type Db = ReturnType<typeof openDatabase>["db"];

/** Real ids of one account's records, one per kind of thing a URL can name. */
export interface AccountIds {
  accountId: string;
  unitId: string;
  workOrderId: string;
  lineId: string;
  findingId: string;
  photoId: string;
  invoiceId: string;
  concernId: string;
  occurrenceId: string;
  invitationId: string;
}

function must<T>(value: T | undefined, what: string): T {
  if (value === undefined) throw new Error(`The demo data has no ${what}; the sweep needs one`);
  return value;
}

export async function accountIdOf(db: Db, accountName: string): Promise<string> {
  const [account] = await db.select({ id: accounts.id }).from(accounts).where(eq(accounts.name, accountName)).limit(1);
  return must(account, `account "${accountName}"`).id;
}

export async function idsOf(db: Db, accountName: string): Promise<AccountIds> {
  const accountId = await accountIdOf(db, accountName);
  // An occurrence fixes the unit, so the nested /units/[id]/occurrences/[occurrenceId] names a real pair.
  const [occurrence] = await db.select({ id: occurrences.id, unitId: occurrences.unitId, concernId: occurrences.concernId }).from(occurrences).where(eq(occurrences.accountId, accountId)).limit(1);
  const occ = must(occurrence, "occurrence");
  const [line] = await db
    .select({ id: estimateLines.id, workOrderId: estimateLines.workOrderId })
    .from(estimateLines)
    .innerJoin(workOrders, eq(workOrders.id, estimateLines.workOrderId))
    .where(and(eq(workOrders.accountId, accountId), eq(estimateLines.state, "proposed")))
    .limit(1);
  const l = must(line, "line waiting for a decision");
  const [finding] = await db.select({ id: findings.id }).from(findings).innerJoin(workOrders, eq(workOrders.id, findings.workOrderId)).where(eq(workOrders.accountId, accountId)).limit(1);
  const [photo] = await db.select({ id: photos.id }).from(photos).where(eq(photos.accountId, accountId)).limit(1);
  const [invoice] = await db.select({ id: invoices.id }).from(invoices).where(eq(invoices.accountId, accountId)).limit(1);
  const [concern] = occ.concernId
    ? [{ id: occ.concernId }]
    : await db.select({ id: concerns.id }).from(concerns).innerJoin(units, eq(units.id, concerns.unitId)).where(eq(units.accountId, accountId)).limit(1);
  // The demo has no invitation waiting; the sweep makes one of the first account's (removed afterwards).
  const [invitation] = await db
    .insert(invitations)
    .values({ email: SWEEP_EMAIL.replace("%", "invitee"), name: "Sweep Invitee", role: "viewer", accountId, tokenHash: `sweep-${accountId}`, expiresAt: new Date(Date.now() + 86_400_000).toISOString(), sentAt: new Date().toISOString() })
    .returning({ id: invitations.id });
  return {
    accountId,
    invitationId: invitation!.id,
    unitId: occ.unitId,
    workOrderId: l.workOrderId,
    lineId: l.id,
    findingId: must(finding, "finding").id,
    photoId: must(photo, "photo").id,
    invoiceId: must(invoice, "invoice").id,
    concernId: must(concern, "concern").id,
    occurrenceId: occ.id,
  };
}

/**
 * What each dynamic segment is filled with, keyed by the folder before it.
 * A new route whose segment is not here fails the sweep with a message naming
 * the key to add: add it here with a real id of the first account.
 */
export function paramValues(ids: AccountIds): Record<string, string> {
  return {
    "units/[id]": ids.unitId,
    "occurrences/[occurrenceId]": ids.occurrenceId,
    "work-orders/[id]": ids.workOrderId,
    "lines/[id]": ids.lineId,
    "findings/[id]": ids.findingId,
    "photos/[id]": ids.photoId,
    "invoices/[id]": ids.invoiceId,
    "accounts/[id]": ids.accountId,
    "receivables/[accountId]": ids.accountId,
    "concerns/[id]": ids.concernId,
    "invitations/[id]": ids.invitationId,
    // Pages an e-mailed link opens: the token is the credential, so any value is a refused link.
    "invitation/[token]": "not-a-link-anyone-was-sent-0000000000000000",
    "reset-password/[token]": "not-a-link-anyone-was-sent-0000000000000000",
    // next-auth's own endpoints: /api/auth/session and friends.
    "auth/[...nextauth]": "session",
  };
}

/** Strings that name one account's things: its name, people, units, work orders, invoices, concerns. */
async function stringsOf(db: Db, accountId: string): Promise<string[]> {
  const [account] = await db.select().from(accounts).where(eq(accounts.id, accountId)).limit(1);
  const people = await db.select({ name: users.name, email: users.email }).from(users).where(eq(users.accountId, accountId));
  const unitRows = await db.select({ n: units.unitNumber, vin: units.vin, plate: units.plate, id: units.id }).from(units).where(eq(units.accountId, accountId));
  const woRows = await db.select({ number: workOrders.number, po: workOrders.poNumber }).from(workOrders).where(eq(workOrders.accountId, accountId));
  const invoiceRows = await db.select({ number: invoices.number }).from(invoices).where(eq(invoices.accountId, accountId));
  const concernRows = unitRows.length
    ? await db.select({ complaint: concerns.complaint }).from(concerns).where(inArray(concerns.unitId, unitRows.map((u) => u.id)))
    : [];
  return [
    account?.name,
    account?.billingEmail,
    account?.taxExemptCertificate,
    ...people.flatMap((p) => [p.name, p.email]),
    ...unitRows.flatMap((u) => [u.n, u.vin, u.plate]),
    ...woRows.flatMap((w) => [workOrderLabel(w.number), w.po]),
    ...invoiceRows.map((i) => invoiceLabel(i.number)),
    ...concernRows.map((c) => c.complaint),
  ].filter((s): s is string => typeof s === "string" && s.trim().length >= 3);
}

/**
 * The first account's strings that the second account's own pages could never
 * show: anything the two share (a common complaint, say) is left out, so a hit
 * is a leak and not a coincidence.
 */
export async function leakStrings(db: Db, first: string, second: string): Promise<string[]> {
  const [a, b] = await Promise.all([stringsOf(db, first), stringsOf(db, second)]);
  return [...new Set(a)].filter((s) => !b.some((t) => t.includes(s) || s.includes(t)));
}

/** Finds the first leaked string in a body; short ones must stand alone (T-14, not T-140). */
export function findLeak(body: string, strings: string[]): string | null {
  for (const s of strings) {
    if (s.length >= 8 ? body.includes(s) : new RegExp(`(?<![\\w-])${s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}(?![\\w-])`).test(body)) return s;
  }
  return null;
}

export interface Persona {
  label: string;
  role: Role | null;
  cookie: string | null;
}

const SWEEP_EMAIL = "sweep-%@kettle-ridge.example";

/** The second account's approver (from the demo) plus a clerk and a viewer made for the sweep. */
export async function personasOf(db: Db, accountId: string, secret: string): Promise<Persona[]> {
  const [approver] = await db.select().from(users).where(and(eq(users.accountId, accountId), eq(users.role, "approver"))).limit(1);
  const made = await db
    .insert(users)
    .values([
      { name: "Sweep Clerk", email: SWEEP_EMAIL.replace("%", "clerk"), role: "clerk", accountId, passwordHash: "x" },
      { name: "Sweep Viewer", email: SWEEP_EMAIL.replace("%", "viewer"), role: "viewer", accountId, passwordHash: "x" },
    ])
    .returning();
  const people = [must(approver, "approver on the second account"), ...made];
  const personas = await Promise.all(
    people.map(async (u) => ({
      label: `${u.role} of another account`,
      role: u.role,
      cookie: `next-auth.session-token=${await encode({ token: { sub: u.id, name: u.name, email: u.email }, secret })}`,
    })),
  );
  return [...personas, { label: "nobody signed in", role: null, cookie: null }];
}

export async function removeSweepPeople(db: Db): Promise<void> {
  await db.delete(users).where(and(like(users.email, SWEEP_EMAIL), isNotNull(users.accountId)));
  await db.delete(invitations).where(like(invitations.email, SWEEP_EMAIL));
}
