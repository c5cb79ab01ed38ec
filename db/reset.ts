import { rmSync } from "node:fs";
import { isFileUrl, openDatabase } from "./client";
import { migrateDatabase } from "./migrate";
import { seedDatabase } from "./seed";

/** The explicit way to start over: wipe, migrate, load the demo data. */
async function reset(url: string, authToken?: string) {
  if (isFileUrl(url)) {
    const file = url.replace(/^file:(\/\/)?/, "");
    for (const suffix of ["", "-wal", "-shm"]) rmSync(`${file}${suffix}`, { force: true });
  } else {
    if (!process.argv.includes("--yes")) {
      throw new Error(`Refusing to wipe the server database at ${url} without --yes.`);
    }
    const { client } = openDatabase(url, authToken);
    const tables = await client.execute("select name from sqlite_master where type = 'table' and name not like 'sqlite_%'");
    await client.execute("PRAGMA foreign_keys = OFF");
    for (const row of tables.rows) await client.execute(`DROP TABLE IF EXISTS "${String(row.name)}"`);
    client.close();
  }
  await migrateDatabase(url, authToken);
  await seedDatabase(url, { authToken });
}

const url = process.env.DATABASE_URL ?? "file:./data/cotter.db";
reset(url, process.env.DATABASE_AUTH_TOKEN)
  .then(() => console.log(`Reset ${url}: migrations applied, demo data loaded.`))
  .catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
