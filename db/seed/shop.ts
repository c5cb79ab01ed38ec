import { counters, laborRates, shopSettings, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { SeedContext } from "./context";

export const DEMO_PASSWORD = "cotter-demo";

export async function seedShop(ctx: SeedContext, passwordHash: string): Promise<void> {
  await ctx.db.insert(shopSettings).values({
    id: 1,
    shopName: "Quarry Road Truck & Equipment",
    addressLine1: "1180 Quarry Road",
    addressLine2: "Alder Falls",
    phone: "(555) 010-4417",
    email: "service@quarry-road.example",
    // 8 % of labour, never more than $50 (a shop setting; common practice in the trade).
    shopSuppliesRateMilliPct: 8_000,
    shopSuppliesCapCents: 5_000,
    shopSuppliesTaxable: false,
    taxLabor: false,
    taxParts: true,
    taxSublet: false,
    taxFees: false,
    invoiceFooter: "Thank you for trusting Quarry Road with your fleet. Questions about this invoice: service@quarry-road.example.",
  });

  const rates = await ctx.db
    .insert(laborRates)
    .values([
      { name: "Shop labour", rateCents: 14_250, isDefault: true, position: 0 },
      { name: "Diagnosis", rateCents: 15_500, position: 1 },
      { name: "Field service", rateCents: 16_500, position: 2 },
    ])
    .returning({ id: laborRates.id, name: laborRates.name });
  for (const r of rates) ctx.ids.set(`rate:${r.name}`, r.id);

  const staff = await ctx.db
    .insert(users)
    .values([
      { email: "owner@quarry-road.example", name: "Ruth Okonkwo", role: "owner", passwordHash },
      { email: "writer@quarry-road.example", name: "Dan Petrakis", role: "writer", passwordHash },
      { email: "tech@quarry-road.example", name: "Luis Ferreira", role: "tech", passwordHash },
      { email: "tech2@quarry-road.example", name: "Jo Lindqvist", role: "tech", passwordHash },
    ])
    .returning({ id: users.id, email: users.email });
  for (const u of staff) ctx.ids.set(`user:${u.email}`, u.id);

  await ctx.db.insert(counters).values([
    { name: "work_order", value: 1000 },
    { name: "invoice", value: 5000 },
  ]);
}

export function demoPasswordHash(): Promise<string> {
  return hashPassword(DEMO_PASSWORD);
}
