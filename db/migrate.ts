import { mkdirSync } from "node:fs";
import path from "node:path";
import { migrate } from "drizzle-orm/libsql/migrator";
import { openDatabase, isFileUrl } from "./client";

/** Applies the committed migrations in drizzle/ to DATABASE_URL. Safe to run again. */
export async function migrateDatabase(url: string, authToken?: string): Promise<void> {
  if (isFileUrl(url)) {
    const file = url.replace(/^file:(\/\/)?/, "");
    mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  }
  const { client, db } = openDatabase(url, authToken);
  try {
    if (isFileUrl(url)) {
      // WAL lets readers go on while one writer commits; the mode is stored in the file.
      await client.execute("PRAGMA journal_mode = WAL");
    }
    await migrate(db, { migrationsFolder: path.join(import.meta.dirname, "..", "drizzle") });
  } finally {
    client.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL ?? "file:./data/cotter.db";
  migrateDatabase(url, process.env.DATABASE_AUTH_TOKEN)
    .then(() => console.log(`Migrations applied to ${url}`))
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
