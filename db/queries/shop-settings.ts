import { eq, ne } from "drizzle-orm";
import { writeTx } from "@/db/client";
import { laborRates, shopSettings } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import type { LaborRateInput, ShopSettingsInput } from "@/lib/validation/shop-settings";
import { recordAudit } from "./audit";

export async function updateShopSettings(user: SessionUser, input: ShopSettingsInput) {
  await writeTx(async (tx) => {
    const [before] = await tx.select().from(shopSettings).where(eq(shopSettings.id, 1));
    const next = {
      shopName: input.shopName,
      addressLine1: input.addressLine1,
      addressLine2: input.addressLine2,
      phone: input.phone,
      email: input.email,
      shopSuppliesRateMilliPct: input.shopSuppliesRate,
      shopSuppliesCapCents: input.shopSuppliesCap,
      shopSuppliesTaxable: input.shopSuppliesTaxable,
      taxLabor: input.taxLabor,
      taxParts: input.taxParts,
      taxSublet: input.taxSublet,
      taxFees: input.taxFees,
      invoiceFooter: input.invoiceFooter,
    };
    const changed = Object.fromEntries(
      (Object.keys(next) as (keyof typeof next)[]).filter((k) => before?.[k] !== next[k]).map((k) => [k, { from: before?.[k], to: next[k] }]),
    );
    await tx.update(shopSettings).set({ ...next, updatedAt: nowIso() }).where(eq(shopSettings.id, 1));
    await recordAudit(tx, user, { action: "shop.settings", entityType: "shop", entityId: "1", detail: changed });
  });
}

/** Adds or changes a labour rate; one rate is the default for new labour lines. */
export async function saveLaborRate(user: SessionUser, input: LaborRateInput) {
  await writeTx(async (tx) => {
    let id = input.id;
    if (id) {
      const [row] = await tx.update(laborRates).set({ name: input.name, rateCents: input.rate, isDefault: input.isDefault, active: input.active }).where(eq(laborRates.id, id)).returning();
      if (!row) throw notFound("That labour rate");
    } else {
      const [row] = await tx.insert(laborRates).values({ name: input.name, rateCents: input.rate, isDefault: input.isDefault, active: input.active, position: 99 }).returning();
      id = row!.id;
    }
    if (input.isDefault) await tx.update(laborRates).set({ isDefault: false }).where(ne(laborRates.id, id));
    await recordAudit(tx, user, { action: "shop.labor_rate", entityType: "shop", entityId: "1", detail: { name: input.name, rateCents: input.rate } });
  });
}
