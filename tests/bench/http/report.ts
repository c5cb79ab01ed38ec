import type { ApprovalsResult } from "./approvals";
import type { LoadResult } from "./load";
import type { PageJs } from "./page-js";

export type Db = "demo" | "big";
/** results[route][db][round] */
export type Rounds = Record<string, Record<Db, LoadResult[]>>;

export function median(values: readonly number[]): number {
  const s = [...values].filter((v) => Number.isFinite(v)).sort((a, b) => a - b);
  if (s.length === 0) return Number.NaN;
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

const ms = (v: number) => (Number.isFinite(v) ? (v >= 100 ? v.toFixed(0) : v.toFixed(1)) : "—");
const x = (v: number) => (Number.isFinite(v) ? `${v.toFixed(v >= 10 ? 0 : 1)}×` : "—");
const rps = (v: number) => (v >= 100 ? v.toFixed(0) : v.toFixed(1));
export const mb = (bytes: number) => `${(bytes / 1_048_576).toFixed(0)} MB`;
export const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`;

/**
 * The routes table: medians over the rounds of req/s, p50 and p99 on each
 * database, p99 as a multiple of /api/v1/me's p99 in the same round and
 * database, p99 growth from the demo database to the big one (per round,
 * then the median), and on the big database p99 as a multiple of the
 * smallest page's (what any page costs the framework, data aside).
 */
export function routesTable(rounds: Rounds, meRoute: string, smallestPage: string): string {
  const rows = [
    "| request | demo req/s | demo p50 | demo p99 | big req/s | big p50 | big p99 | × me, demo | × me, big | growth demo→big | × smallest page, big | errors |",
    "| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |",
  ];
  const against = (byDb: Rounds[string], base: Rounds[string], db: Db) => median(byDb[db].map((r, i) => r.p99 / (base[db][i]?.p99 ?? Number.NaN)));
  for (const [route, byDb] of Object.entries(rounds)) {
    const ratio = (db: Db) => against(byDb, rounds[meRoute]!, db);
    const growth = median(byDb.big.map((r, i) => r.p99 / (byDb.demo[i]?.p99 ?? Number.NaN)));
    const m = (db: Db, key: "rps" | "p50" | "p99") => median(byDb[db].map((r) => r[key]));
    const errors = [...byDb.demo, ...byDb.big].reduce((s, r) => s + r.non2xx + r.errors, 0);
    rows.push(
      `| ${route} | ${rps(m("demo", "rps"))} | ${ms(m("demo", "p50"))} | ${ms(m("demo", "p99"))} | ${rps(m("big", "rps"))} | ${ms(m("big", "p50"))} | ${ms(m("big", "p99"))} | ${x(ratio("demo"))} | ${x(ratio("big"))} | ${x(growth)} | ${x(against(byDb, rounds[smallestPage]!, "big"))} | ${errors} |`,
    );
  }
  return rows.join("\n");
}

export function approvalsText(a: ApprovalsResult, connections: number): string {
  const lines = [
    `approvals (POST /api/v1/lines/:id/decision, ${connections} connections, township, big database), ${a.rounds.length} round(s):`,
    ...a.rounds.map((r, i) => `  round ${i + 1}: ${r.ok} approved in ${r.seconds.toFixed(1)} s = ${rps(r.rps)}/s   p50 ${ms(r.p50)} ms   p99 ${ms(r.p99)} ms   refused ${r.non2xx}   errors ${r.errors}`),
    `  median: ${rps(median(a.rounds.map((r) => r.rps)))} approvals/s, p99 ${ms(median(a.rounds.map((r) => r.p99)))} ms`,
    `  none lost: ${a.ok} answered 200 (warm-up included); the database holds ${a.inDatabase.lines} of those lines approved with ${a.inDatabase.decisions} approve decisions; ${a.refused} refused or failed` +
      (a.ok === a.inDatabase.lines && a.ok === a.inDatabase.decisions && a.refused === 0 ? " — match" : " — MISMATCH"),
  ];
  return lines.join("\n");
}

export function memoryText(memory: Record<Db, { idle: number; peak: number; after: number }>): string {
  return (["demo", "big"] as const)
    .map((db) => `  ${db}: idle ${mb(memory[db].idle)}, peak under load ${mb(memory[db].peak)}, after the load ${mb(memory[db].after)}`)
    .join("\n");
}

export function jsText(js: PageJs): string {
  const top = js.own.slice(0, 6).map((f) => `    ${f.file}  ${kb(f.gzip)}`);
  return [
    `  HTML ${kb(js.htmlBytes)}; JS gzipped: framework root files ${kb(js.rootGzip)}, the page's own ${kb(js.ownGzip)} in ${js.own.length} chunks, total ${kb(js.rootGzip + js.ownGzip)}`,
    `  largest own chunks:`,
    ...top,
  ].join("\n");
}
