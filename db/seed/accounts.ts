import { accountContacts, accounts, users } from "@/db/schema";
import type { SeedContext } from "./context";

/** The three fleet accounts of the demo scenario (product.md), all invented. */
export async function seedAccounts(ctx: SeedContext, passwordHash: string): Promise<void> {
  const rows = await ctx.db
    .insert(accounts)
    .values([
      {
        name: "Brennan Township Highway Department",
        billingEmail: "clerk@brennan-twp.example",
        phone: "(555) 010-2210",
        address: "40 Township Hall Road\nBrennan Township",
        taxExempt: true,
        taxExemptCertificate: "EX-BT-20417",
        poRequired: true,
        paymentTermsDays: 30,
        // First hour of diagnosis at the diagnosis rate, without asking.
        standingAuthorisationCents: 15_500,
        repairBudgetCents: 8_500_000,
        fiscalYearStartMonth: 1,
        notes: "Road supervisor approves up to $5,000 per work order; the trustee signs above that.",
      },
      {
        name: "Alder Falls School District Transportation",
        billingEmail: "transport@alder-falls-schools.example",
        phone: "(555) 010-3380",
        address: "12 Depot Street\nAlder Falls",
        taxExempt: true,
        taxExemptCertificate: "EX-AFSD-0093",
        poRequired: false,
        paymentTermsDays: 30,
        standingAuthorisationCents: 20_000,
        repairBudgetCents: 4_800_000,
        fiscalYearStartMonth: 7,
        shopSuppliesExempt: false,
        notes: "Buses must pass the pre-trip brake check before release.",
      },
      {
        name: "Kettle Ridge Stone Co.",
        billingEmail: "office@kettle-ridge.example",
        phone: "(555) 010-7765",
        address: "3 Kettle Ridge Pit Road\nAlder Falls",
        taxExempt: false,
        taxRateMilliPct: 6_250,
        poRequired: false,
        paymentTermsDays: 30,
        standingAuthorisationCents: 50_000,
        repairBudgetCents: null,
        fiscalYearStartMonth: 1,
        notes: "Private quarry; net 30.",
      },
    ])
    .returning({ id: accounts.id, name: accounts.name });
  const [township, schools, quarry] = rows.map((r) => r.id) as [string, string, string];
  ctx.ids.set("account:township", township);
  ctx.ids.set("account:schools", schools);
  ctx.ids.set("account:quarry", quarry);

  await ctx.db.insert(accountContacts).values([
    { accountId: township, name: "Gary Holm", title: "Road supervisor", email: "supervisor@brennan-twp.example", phone: "(555) 010-2214" },
    { accountId: township, name: "Ann Mercer", title: "Township clerk", email: "clerk@brennan-twp.example", phone: "(555) 010-2211", isBilling: true },
    { accountId: schools, name: "Priya Natarajan", title: "Transportation director", email: "transport@alder-falls-schools.example", isBilling: true },
    { accountId: quarry, name: "Carl Brandt", title: "Office manager", email: "office@kettle-ridge.example", isBilling: true },
  ]);

  const fleetUsers = await ctx.db
    .insert(users)
    .values([
      { email: "supervisor@brennan-twp.example", name: "Gary Holm", role: "approver", accountId: township, signingLimitCents: 500_000, passwordHash },
      { email: "trustee@brennan-twp.example", name: "Helen Vasquez", role: "approver", accountId: township, signingLimitCents: 2_500_000, passwordHash },
      { email: "clerk@brennan-twp.example", name: "Ann Mercer", role: "clerk", accountId: township, passwordHash },
      { email: "foreman@brennan-twp.example", name: "Walt Dziedzic", role: "viewer", accountId: township, passwordHash },
      { email: "transport@alder-falls-schools.example", name: "Priya Natarajan", role: "approver", accountId: schools, signingLimitCents: 250_000, passwordHash },
      { email: "office@kettle-ridge.example", name: "Carl Brandt", role: "approver", accountId: quarry, signingLimitCents: 1_000_000, passwordHash },
    ])
    .returning({ id: users.id, email: users.email });
  for (const u of fleetUsers) ctx.ids.set(`user:${u.email}`, u.id);
}
