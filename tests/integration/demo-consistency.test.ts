// The demo reads right to a practitioner, whatever day it is loaded on (the seed is laid out
// relative to now): things happen in a sane order, and the weather fits the date. The
// temperature bands below are an independent sanity check (common practice for an inland
// northern town: a September morning is not 9 °F), not the seed's own climate curve.
import { rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";

/** Plausible early-morning / daytime temperatures by month, °F (lowest, highest). */
const MONTH_BAND_F: Record<number, [number, number]> = {
  1: [-30, 40], 2: [-30, 42], 3: [-15, 52], 4: [8, 65], 5: [25, 75], 6: [35, 82],
  7: [40, 85], 8: [38, 85], 9: [25, 75], 10: [10, 65], 11: [-10, 52], 12: [-25, 42],
};

const files: string[] = [];
afterAll(() => {
  for (const f of files) for (const s of ["", "-wal", "-shm"]) rmSync(`${f}${s}`, { force: true });
});

async function seededAt(now: string) {
  const file = path.join(tmpdir(), `cotter-demo-${now.slice(0, 10)}-${process.pid}.db`);
  files.push(file);
  rmSync(file, { force: true });
  const url = `file:${file}`;
  await migrateDatabase(url);
  await seedDatabase(url, { photos: false, now: new Date(now) });
  return openDatabase(url).client;
}

const ORDER_CHECKS: [string, string][] = [
  ["no decision before its visit began", "SELECT w.number FROM decisions d JOIN work_orders w ON w.id = d.work_order_id WHERE d.at < w.opened_at"],
  ["no decision after its visit was released", "SELECT w.number FROM decisions d JOIN work_orders w ON w.id = d.work_order_id WHERE w.released_at IS NOT NULL AND d.at > w.released_at"],
  ["no decision on a line before the line was written", "SELECT d.id FROM decisions d JOIN estimate_lines l ON l.id = d.line_id WHERE d.at < l.created_at"],
  ["no customer decision before the estimate was sent", "SELECT w.number FROM decisions d JOIN work_orders w ON w.id = d.work_order_id WHERE d.by_standing = 0 AND d.at < coalesce((SELECT min(e.at) FROM status_events e WHERE e.work_order_id = w.id AND e.status = 'waiting_approval'), '9999')"],
  ["no line written before its visit began", "SELECT w.number FROM estimate_lines l JOIN work_orders w ON w.id = l.work_order_id WHERE l.created_at < w.opened_at"],
  ["no finding posted before the status said Diagnosing", "SELECT w.number FROM findings f JOIN work_orders w ON w.id = f.work_order_id WHERE f.created_at < coalesce((SELECT min(e.at) FROM status_events e WHERE e.work_order_id = w.id AND e.status = 'diagnosing'), '9999')"],
  ["no time clocked before the line was approved", "SELECT t.id FROM time_entries t JOIN estimate_lines l ON l.id = t.line_id WHERE l.approved_at IS NULL OR t.started_at < l.approved_at"],
  ["no invoice before its visit was released", "SELECT w.number FROM invoices i JOIN work_orders w ON w.id = i.work_order_id WHERE w.released_at IS NULL OR i.issued_at < w.released_at"],
  ["no payment before its invoice", "SELECT p.id FROM payments p JOIN invoices i ON i.id = p.invoice_id WHERE p.received_at < i.issued_at"],
  ["no occurrence logged before its concern was raised", "SELECT o.id FROM occurrences o JOIN concerns c ON c.id = o.concern_id WHERE o.occurred_at < c.created_at"],
];

describe.each(["2026-09-15T15:00:00Z", "2026-12-02T18:00:00Z", "2027-07-01T14:00:00Z"])("the demo loaded on %s", (now) => {
  it("happens in a sane order, and nothing happens after now", async () => {
    const client = await seededAt(now);
    for (const [what, query] of ORDER_CHECKS) expect((await client.execute(query)).rows, what).toEqual([]);
    for (const table of ["status_events", "decisions", "findings", "occurrences"]) {
      const col = table === "findings" ? "created_at" : table === "occurrences" ? "occurred_at" : "at";
      expect((await client.execute({ sql: `SELECT count(*) AS n FROM ${table} WHERE ${col} > ?`, args: [now] })).rows[0], table).toMatchObject({ n: 0 });
    }
    // A finding or a decision at 3 a.m. reads wrong: the shop's working day (its zone, APP_TIME_ZONE's default).
    const hour = (iso: unknown) => Number(new Intl.DateTimeFormat("en-US", { hour: "numeric", hourCycle: "h23", timeZone: "America/Chicago" }).format(new Date(String(iso))));
    for (const r of (await client.execute("SELECT created_at AS at FROM findings UNION ALL SELECT at FROM decisions WHERE by_standing = 0")).rows) {
      expect(hour(r.at), String(r.at)).toBeGreaterThanOrEqual(7);
      expect(hour(r.at), String(r.at)).toBeLessThan(17);
    }
    client.close();
  });

  it("has weather that fits each date, and weekend soaks that end on a Monday", async () => {
    const client = await seededAt(now);
    const rows = (await client.execute("SELECT occurred_at, ambient_c, hours_parked, note FROM occurrences")).rows;
    expect(rows.length).toBeGreaterThan(10);
    for (const r of rows) {
      const at = new Date(String(r.occurred_at));
      const f = (Number(r.ambient_c) * 9) / 5 + 32;
      const [lo, hi] = MONTH_BAND_F[at.getUTCMonth() + 1]!;
      expect(f, `${at.toISOString().slice(0, 10)}: ${f.toFixed(0)} °F`).toBeGreaterThanOrEqual(lo);
      expect(f, `${at.toISOString().slice(0, 10)}: ${f.toFixed(0)} °F`).toBeLessThanOrEqual(hi);
      if (/weekend/i.test(String(r.note))) expect(at.getUTCDay(), String(r.note)).toBe(1);
      // Salt goes on roads that can freeze.
      if (/salted/i.test(String(r.note))) expect(f).toBeLessThanOrEqual(36);
    }
    client.close();
  });
});
