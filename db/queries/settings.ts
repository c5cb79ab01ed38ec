import { eq } from "drizzle-orm";
import { cache } from "react";
import { getDb } from "@/db/client";
import { accounts, shopSettings } from "@/db/schema";

export const getShopSettings = cache(async () => {
  const [row] = await getDb().select().from(shopSettings).where(eq(shopSettings.id, 1)).limit(1);
  if (!row) throw new Error("Shop settings are missing: run `npm run db:seed`.");
  return row;
});

export const getAccountName = cache(async (accountId: string) => {
  const [row] = await getDb().select({ name: accounts.name }).from(accounts).where(eq(accounts.id, accountId)).limit(1);
  return row?.name ?? "Your fleet";
});
