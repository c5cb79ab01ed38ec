import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { estimateLines, invoices, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import type { LineKind, LineState } from "@/lib/domain";
import { userByEmail } from "./app";

/** The signed-in user as the server sees them, for calling db/queries writes directly. */
export async function asUser(email: string): Promise<SessionUser> {
  const u = await userByEmail(email);
  return { id: u.id, name: u.name, email: u.email, role: u.role, accountId: u.accountId, signingLimitCents: u.signingLimitCents, via: "session" };
}

export interface LineFixture {
  kind: LineKind;
  description: string;
  quantityMilli: number;
  unitPriceCents: number;
  taxable?: boolean;
  coreChargeCents?: number;
  state?: LineState;
}

/** Replaces a work order's lines with these (done unless told otherwise). */
export async function setLines(workOrderId: string, lines: LineFixture[]): Promise<string[]> {
  const db = getDb();
  await db.delete(estimateLines).where(eq(estimateLines.workOrderId, workOrderId));
  const rows = await db
    .insert(estimateLines)
    .values(
      lines.map((l, i) => ({
        workOrderId,
        position: i,
        kind: l.kind,
        description: l.description,
        quantityMilli: l.quantityMilli,
        unitPriceCents: l.unitPriceCents,
        taxable: l.taxable ?? false,
        coreChargeCents: l.coreChargeCents ?? 0,
        state: l.state ?? "done",
      })),
    )
    .returning({ id: estimateLines.id });
  return rows.map((r) => r.id);
}

export async function allInvoiceNumbers(): Promise<number[]> {
  const rows = await getDb().select({ n: invoices.number }).from(invoices).orderBy(invoices.number);
  return rows.map((r) => r.n);
}

export async function userIdOf(email: string): Promise<string> {
  const [u] = await getDb().select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
  if (!u) throw new Error(`no user ${email}`);
  return u.id;
}
