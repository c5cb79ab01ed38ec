import { cpSync, readFileSync, readdirSync, unlinkSync, writeFileSync } from "node:fs";
import path from "node:path";

/** The committed migrations folder (what `npm run db:migrate` applies). */
export const COMMITTED_MIGRATIONS = path.join(import.meta.dirname, "..", "..", "..", "drizzle");

/**
 * A copy of the committed migrations as they stood up to and including `lastIdx`,
 * in a folder of its own under `dir`: a database migrated with it is one made by
 * the code before a later migration, to test that migration on real rows.
 * Returns the folder and the tag of the last migration kept.
 */
export function migrationsUpTo(dir: string, lastIdx: number): { folder: string; lastTag: string | undefined } {
  const folder = path.join(dir, `up-to-${lastIdx}`);
  cpSync(COMMITTED_MIGRATIONS, folder, { recursive: true });
  const journalPath = path.join(folder, "meta", "_journal.json");
  const journal = JSON.parse(readFileSync(journalPath, "utf8")) as { entries: { idx: number; tag: string }[] };
  const kept = journal.entries.filter((e) => e.idx <= lastIdx);
  writeFileSync(journalPath, JSON.stringify({ ...journal, entries: kept }));
  for (const file of readdirSync(folder)) {
    if (file.endsWith(".sql") && !kept.some((e) => file === `${e.tag}.sql`)) unlinkSync(path.join(folder, file));
  }
  return { folder, lastTag: kept.at(-1)?.tag };
}
