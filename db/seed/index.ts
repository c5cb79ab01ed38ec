import { openDatabase } from "@/db/client";
import { settleNothingToBill } from "@/db/queries/billing-state";
import { rebuildBudgetUse } from "@/db/queries/budget-use";
import { shopSettings } from "@/db/schema";
import { seedAccounts } from "./accounts";
import { seedEstimates } from "./estimates";
import { seedInvoices } from "./invoices";
import type { SeedContext } from "./context";
import { storeDemoPhotos } from "./demo-photos";
import { seedFindings } from "./findings";
import { seedOccurrences } from "./occurrences";
import { demoPasswordHash, seedShop } from "./shop";
import { seedUnits } from "./units";
import { seedWorkOrders } from "./work-orders";

/** Loads the invented demo world (product.md's scenario) into an empty database, in one transaction. */
export async function seedDatabase(
  url: string,
  options: { ifEmpty?: boolean; authToken?: string; now?: Date; photos?: boolean } = {},
) {
  const { client, db } = openDatabase(url, options.authToken);
  try {
    const existing = await db.select({ id: shopSettings.id }).from(shopSettings).limit(1);
    if (existing.length > 0) {
      if (options.ifEmpty) return { seeded: false as const };
      throw new Error("The database already has data. Use `npm run db:reset` to start over.");
    }
    const passwordHash = await demoPasswordHash();
    // Stored before the transaction: the upload service is not part of it.
    const demoPhotos = options.photos === false ? null : await storeDemoPhotos();
    await db.transaction(async (tx) => {
      const ctx: SeedContext = { db: tx, now: options.now ?? new Date(), ids: new Map(), milestones: new Map() };
      await seedShop(ctx, passwordHash);
      await seedAccounts(ctx, passwordHash);
      await seedUnits(ctx);
      await seedWorkOrders(ctx);
      // Past visits' billed work first, so the estimates step sets budgets with it counted.
      await seedInvoices(ctx);
      await seedFindings(ctx, demoPhotos);
      await seedEstimates(ctx);
      await seedOccurrences(ctx);
      await rebuildBudgetUse(tx, ctx.now);
      await settleNothingToBill(tx);
    });
    return { seeded: true as const };
  } finally {
    client.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL ?? "file:./data/cotter.db";
  seedDatabase(url, { ifEmpty: process.argv.includes("--if-empty"), authToken: process.env.DATABASE_AUTH_TOKEN })
    .then((r) => console.log(r.seeded ? `Demo data loaded into ${url}` : `${url} already has data; left as it is.`))
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
