/**
 * The HTTP benchmark (issue 13): `next start` on the demo database and on
 * the big one (tests/bench/big-db), signed in as the township's people,
 * autocannon at 32 connections in rounds interleaved between the two; then
 * approvals per second on the big township with a database count that proves
 * none were lost; the server's memory; the approval page's own JS and its
 * largest contentful paint on a phone in Chromium.
 *
 * Run: npm run bench -- http [--quick] [--skip-build]
 *   --quick       one 3 s round per route (a smoke run); a full run is three 10 s rounds
 *   --skip-build  reuse the last build in NEXT_DIST_DIR (default .next-bench)
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { loadavg } from "node:os";
import path from "node:path";
import { manifestFile, type BigManifest } from "./big-db/generate";
import { runApprovals } from "./http/approvals";
import { readFixtures, type Fixtures, type Person } from "./http/fixtures";
import { measureLcp } from "./http/lcp";
import { load } from "./http/load";
import { pageJs } from "./http/page-js";
import { approvalsText, jsText, memoryText, routesTable, type Db, type Rounds } from "./http/report";
import { buildApp, ROOT, startApp, startMailSink, type AppServer } from "./http/server";

const args = process.argv.slice(2);
const quick = args.includes("--quick");
const cfg = quick
  ? { rounds: 1, seconds: 3, warm: 1, approvalRounds: 1, approvalSeconds: 3 }
  : { rounds: 3, seconds: 10, warm: 2, approvalRounds: 3, approvalSeconds: 10 };
const CONNECTIONS = 32;
const APPROVAL_CONNECTIONS = 16;
const distDir = process.env.NEXT_DIST_DIR || ".next-bench";
const dir = path.join(ROOT, "tests", ".artifacts", "bench");
const load1 = () => loadavg().map((l) => l.toFixed(2)).join(" ");

interface Route {
  name: string;
  as: Person | null;
  path: (f: Fixtures) => string;
  /** What a right answer looks like: a wrong cookie or a redirect must not pass for a fast page. */
  check: (body: string) => boolean;
}

const json = (body: string) => JSON.parse(body) as Record<string, unknown[] | undefined>;
const ME = "GET /api/v1/me";
const SMALLEST_PAGE = "smallest page: /fleet/me (supervisor)";
const ROUTES: Route[] = [
  { name: "GET /api/v1/health (no auth)", as: null, path: () => "/api/v1/health", check: (b) => b.length > 0 },
  { name: ME, as: "supervisor", path: () => "/api/v1/me", check: (b) => "id" in json(b) },
  { name: "GET /api/v1/units", as: "supervisor", path: () => "/api/v1/units", check: (b) => (json(b).units?.length ?? 0) > 0 },
  { name: "GET /api/v1/work-orders", as: "supervisor", path: () => "/api/v1/work-orders", check: (b) => (json(b).workOrders?.length ?? 0) > 0 },
  { name: "GET /api/v1/work-orders/:id (W-1042, 11 lines)", as: "supervisor", path: (f) => `/api/v1/work-orders/${f.w1042}`, check: (b) => json(b).lines?.length === 11 },
  { name: "GET /api/v1/invoices (clerk)", as: "clerk", path: () => "/api/v1/invoices", check: (b) => (json(b).invoices?.length ?? 0) > 0 },
  // The floor under every page: a signed-in page that reads nothing but its caller (the person's own sign-in).
  { name: SMALLEST_PAGE, as: "supervisor", path: () => "/fleet/me", check: (b) => b.includes("</html>") },
  { name: "fleet approval page, W-1042 (11 lines)", as: "supervisor", path: (f) => `/fleet/work-orders/${f.w1042}`, check: (b) => b.includes("</html>") && b.includes("W-1042") },
  { name: "fleet approval page, 250 lines", as: "supervisor", path: (f) => `/fleet/work-orders/${f.bigVisit}`, check: (b) => b.includes("</html>") && b.length > 50_000 },
  { name: "/floor (writer)", as: "writer", path: () => "/floor", check: (b) => b.includes("units in the shop") },
];

async function checkRoutes(server: AppServer, f: Fixtures): Promise<void> {
  for (const r of ROUTES) {
    const res = await fetch(`${server.baseUrl}${r.path(f)}`, { headers: r.as ? { cookie: f.cookies[r.as] } : {}, redirect: "manual" });
    const body = await res.text();
    if (res.status !== 200 || !r.check(body)) throw new Error(`${server.name}: ${r.name} answered ${res.status} with ${body.slice(0, 300)}`);
  }
}

/** Each database is written by its own process (the command line in big-db/generate.ts), which prints what it wrote. */
function generate(scale: "demo" | "big", file: string): BigManifest {
  const child = spawnSync(process.execPath, ["--import", "tsx", path.join(import.meta.dirname, "big-db", "generate.ts"), "--scale", scale, "--out", file], { stdio: "inherit" });
  if (child.status !== 0) throw new Error(`writing the ${scale} database failed`);
  return JSON.parse(readFileSync(manifestFile(file), "utf8")) as BigManifest;
}

/**
 * When a round ends the server still works through the requests in flight
 * (the database calls block its event loop while they run); the next round
 * starts once that tail is done, so it does not land on the next figure.
 */
async function drain(server: AppServer): Promise<void> {
  await fetch(`${server.baseUrl}/api/v1/health`);
  await new Promise((r) => setTimeout(r, 500));
}

async function main() {
  mkdirSync(dir, { recursive: true });
  const startedAt = Date.now();
  const loadAtStart = load1();
  console.log(`http bench (${quick ? "quick" : "full"}): load average at start ${loadAtStart}`);

  const buildSeconds = args.includes("--skip-build") && existsSync(path.join(ROOT, distDir, "BUILD_ID")) ? 0 : buildApp(distDir);
  console.log(buildSeconds ? `  next build into ${distDir}: ${buildSeconds.toFixed(0)} s` : `  reusing the build in ${distDir}`);

  const files: Record<Db, string> = { demo: path.join(dir, "demo.db"), big: path.join(dir, "big.db") };
  generate("demo", files.demo);
  const big = generate("big", files.big);

  const mail = await startMailSink();
  const servers: Record<Db, AppServer> = {
    demo: await startApp("demo", { distDir, dbFile: files.demo, smtpPort: mail.port }),
    big: await startApp("big", { distDir, dbFile: files.big, smtpPort: mail.port }),
  };
  try {
    const fixtures: Record<Db, Fixtures> = { demo: await readFixtures(files.demo), big: await readFixtures(files.big) };
    for (const db of ["demo", "big"] as const) await checkRoutes(servers[db], fixtures[db]);
    const memory = {
      demo: { idle: servers.demo.rss(), peak: 0, after: 0 },
      big: { idle: servers.big.rss(), peak: 0, after: 0 },
    };
    const sampler = setInterval(() => {
      for (const db of ["demo", "big"] as const) memory[db].peak = Math.max(memory[db].peak, servers[db].rss());
    }, 250);

    const run = async (db: Db, route: Route, seconds: number) => {
      const result = await load({
        url: `${servers[db].baseUrl}${route.path(fixtures[db])}`,
        connections: CONNECTIONS,
        duration: seconds,
        headers: route.as ? { cookie: fixtures[db].cookies[route.as] } : {},
      });
      await drain(servers[db]);
      return result;
    };
    for (const route of ROUTES) for (const db of ["demo", "big"] as const) await run(db, route, cfg.warm);

    const rounds: Rounds = Object.fromEntries(ROUTES.map((r) => [r.name, { demo: [], big: [] }]));
    for (let i = 0; i < cfg.rounds; i++) {
      // Alternate which database goes first, so drift in the machine's load falls on both.
      const order: Db[] = i % 2 === 0 ? ["big", "demo"] : ["demo", "big"];
      for (const route of ROUTES) {
        for (const db of order) {
          const r = await run(db, route, cfg.seconds);
          rounds[route.name]![db].push(r);
          console.log(`  round ${i + 1} ${db.padEnd(4)} ${route.name.padEnd(48)} ${r.rps.toFixed(1).padStart(7)} req/s  p50 ${r.p50} ms  p99 ${r.p99} ms${r.non2xx || r.errors ? `  NON-2XX ${r.non2xx} ERRORS ${r.errors}` : ""}`);
        }
      }
    }
    clearInterval(sampler);
    await new Promise((r) => setTimeout(r, 2_000));
    for (const db of ["demo", "big"] as const) memory[db].after = servers[db].rss();
    const loadAfterRoutes = load1();

    const approvals = await runApprovals(servers.big.baseUrl, files.big, fixtures.big, big.pool, {
      rounds: cfg.approvalRounds, seconds: cfg.approvalSeconds, connections: APPROVAL_CONNECTIONS,
    });

    const html = await (await fetch(`${servers.big.baseUrl}/fleet/work-orders/${fixtures.big.bigVisit}`, { headers: { cookie: fixtures.big.cookies.supervisor } })).text();
    const js = pageJs(html, distDir);
    // After the load, on a quiet server: the page as one approver meets it.
    const lcp = await measureLcp(`${servers.big.baseUrl}/fleet/work-orders/${fixtures.big.bigVisit}`, fixtures.big.cookies.supervisor);

    const report = [
      "",
      `## HTTP bench (${quick ? "quick: one 3 s round" : `${cfg.rounds} rounds of ${cfg.seconds} s`}, ${CONNECTIONS} connections, medians)`,
      "",
      routesTable(rounds, ME, SMALLEST_PAGE),
      "",
      approvalsText(approvals, APPROVAL_CONNECTIONS),
      // Decision mail now waits in the outbox for two minutes so a burst reaches the writer as one message.
      `  e-mails the mail sink took during the run: ${mail.received()} (decision mail is grouped per work order and sent later)`,
      "",
      "server memory (VmRSS of next-server):",
      memoryText(memory),
      "",
      "approval page (250 lines), big database:",
      jsText(js),
      `  LCP on a 390 px phone viewport (headless Chromium, ${lcp.loads.length} cold loads): median ${lcp.medianMs} ms (${lcp.loads.join(", ")})`,
      "",
      `load average (1, 5, 15 min): ${loadAtStart} at the start, ${loadAfterRoutes} after the routes, ${load1()} at the end; ${((Date.now() - startedAt) / 60_000).toFixed(1)} min in all`,
    ].join("\n");
    console.log(report);
    writeFileSync(path.join(dir, "http-results.json"), JSON.stringify({ quick, cfg, rounds, approvals: { ...approvals }, memory, js, lcp, big: { counts: big.counts, seconds: big.seconds } }, null, 2));
    const lost = approvals.ok !== approvals.inDatabase.lines || approvals.ok !== approvals.inDatabase.decisions || approvals.refused > 0;
    if (lost) process.exitCode = 1;
  } finally {
    await Promise.all([servers.demo.stop(), servers.big.stop()]);
    await mail.close();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
