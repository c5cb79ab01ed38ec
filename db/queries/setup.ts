import { count } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { counters, laborRates, shopSettings, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { conflict } from "@/lib/http/problem";
import type { SetupInput } from "@/lib/validation/setup";
import { recordAudit } from "./audit";

// Once someone exists, nobody is ever removed from the users table, so the answer never goes back.
const holder = globalThis as unknown as { __cotterSetUp?: boolean };

/** True while the database has no users: the app then offers only the one-time set-up page. */
export async function needsSetup(): Promise<boolean> {
  if (holder.__cotterSetUp) return false;
  const [row] = await getDb().select({ n: count() }).from(users);
  if ((row?.n ?? 0) > 0) {
    holder.__cotterSetUp = true;
    return false;
  }
  return true;
}

/** Tests open a new database in the same process; let them ask again. */
export function forgetSetupState(): void {
  holder.__cotterSetUp = undefined;
}

const alreadySetUp = () =>
  conflict("already_set_up", "Cotter is already set up for a shop. Sign in, or ask the owner to invite you.");

/**
 * Creates the shop and its owner on an empty database, once. The check for
 * "no users yet" runs inside the write transaction (BEGIN IMMEDIATE), so two
 * set-ups racing each other, in one process or several, cannot both pass it;
 * the unique e-mail and the shop row's fixed id back that up.
 */
export async function runFirstSetup(input: SetupInput) {
  const passwordHash = await hashPassword(input.password);
  try {
    const owner = await writeTx(async (tx) => {
      const [existing] = await tx.select({ n: count() }).from(users);
      if ((existing?.n ?? 0) > 0) throw alreadySetUp();
      const shop = {
        shopName: input.shopName,
        addressLine1: input.addressLine1,
        addressLine2: input.addressLine2,
        phone: input.phone,
        email: input.shopEmail ?? input.ownerEmail,
        invoiceFooter: `Questions about this invoice: ${input.shopEmail ?? input.ownerEmail}.`,
      };
      // A database made by an older install may hold the shop row without people: take it over.
      await tx.insert(shopSettings).values({ id: 1, ...shop }).onConflictDoUpdate({ target: shopSettings.id, set: shop });
      await tx.insert(laborRates).values({ name: "Shop labour", rateCents: input.laborRateCents, isDefault: true, position: 0 });
      // Work orders and invoices are numbered from 1001 up, with no gaps.
      await tx.insert(counters).values([{ name: "work_order", value: 1000 }, { name: "invoice", value: 1000 }]).onConflictDoNothing();
      const [row] = await tx
        .insert(users)
        .values({ email: input.ownerEmail, name: input.ownerName, role: "owner", passwordHash })
        .returning({ id: users.id, email: users.email, name: users.name });
      await recordAudit(tx, { id: row!.id, name: row!.name, role: "owner" }, { action: "shop.set_up", entityType: "shop", entityId: "1", detail: { shopName: input.shopName } });
      return row!;
    });
    holder.__cotterSetUp = true;
    return owner;
  } catch (error) {
    // Another instance committed first: its shop row or its owner's e-mail is already there.
    if (error instanceof Error && /UNIQUE constraint failed/.test(String(error.cause ?? error.message))) throw alreadySetUp();
    throw error;
  }
}
