import type { Metadata } from "next";
import { asc } from "drizzle-orm";
import { LaborRateRow } from "@/components/settings/labor-rate-row";
import { ShopSettingsForm } from "@/components/settings/shop-settings-form";
import { Card, CardTitle } from "@/components/ui/card";
import { PageHeader } from "@/components/ui/page-header";
import { getDb } from "@/db/client";
import { getShopSettings } from "@/db/queries/settings";
import { laborRates } from "@/db/schema";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";

export const metadata: Metadata = { title: "Shop settings" };

const dollars = (cents: number) => (cents / 100).toFixed(2);

export default async function ShopSettingsPage() {
  await requirePageRole(CAN.manageShop);
  const [s, rates] = await Promise.all([getShopSettings(), getDb().select().from(laborRates).orderBy(asc(laborRates.position))]);
  return (
    <>
      <PageHeader title="Shop settings" kicker="Owner only" />
      <div className="flex flex-col gap-4">
        <Card>
          <CardTitle>Labour rates</CardTitle>
          {rates.map((r) => (
            <LaborRateRow key={r.id} rate={{ id: r.id, name: r.name, rate: dollars(r.rateCents), isDefault: r.isDefault, active: r.active }} />
          ))}
          <LaborRateRow />
        </Card>
        <Card>
          <CardTitle>The shop, fees and tax</CardTitle>
          <ShopSettingsForm
            initial={{
              shopName: s.shopName,
              addressLine1: s.addressLine1,
              addressLine2: s.addressLine2,
              phone: s.phone,
              email: s.email,
              shopSuppliesRate: String(s.shopSuppliesRateMilliPct / 1000),
              shopSuppliesCap: dollars(s.shopSuppliesCapCents),
              shopSuppliesTaxable: s.shopSuppliesTaxable,
              taxLabor: s.taxLabor,
              taxParts: s.taxParts,
              taxSublet: s.taxSublet,
              taxFees: s.taxFees,
              invoiceFooter: s.invoiceFooter,
            }}
          />
        </Card>
      </div>
    </>
  );
}
