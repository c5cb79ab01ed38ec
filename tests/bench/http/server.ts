import { spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { startRunningNextServer } from "../../support/next-server";
import { freePort } from "../../support/ports";

export { freePort };

export const ROOT = path.join(import.meta.dirname, "..", "..", "..");
export const SECRET = "bench-secret-bench-secret-bench-secret!!";

/**
 * `next build` into its own directory. Next adds that directory's type
 * folders to tsconfig.json on every build; the file is put back as it was,
 * so a benchmark run leaves the checkout clean.
 */
export function buildApp(distDir: string): number {
  const started = Date.now();
  const tsconfig = path.join(ROOT, "tsconfig.json");
  const before = readFileSync(tsconfig, "utf8");
  try {
    const build = spawnSync(path.join(ROOT, "node_modules", ".bin", "next"), ["build"], {
      cwd: ROOT,
      env: { ...process.env, NEXT_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1" },
      stdio: ["ignore", "ignore", "inherit"],
    });
    if (build.status !== 0) throw new Error("next build failed");
  } finally {
    if (readFileSync(tsconfig, "utf8") !== before) writeFileSync(tsconfig, before);
  }
  return (Date.now() - started) / 1000;
}

/** An SMTP server that takes every message and throws it away: the app's mail path runs as in production, cheaply. */
export async function startMailSink(): Promise<{ port: number; received: () => number; close: () => Promise<void> }> {
  let received = 0;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      stream.on("end", () => {
        received += 1;
        callback();
      });
      stream.resume();
    },
  });
  const port = await freePort();
  await new Promise<void>((resolve) => smtp.listen(port, "127.0.0.1", resolve));
  return { port, received: () => received, close: () => new Promise<void>((resolve) => smtp.close(() => resolve())) };
}

export interface AppServer {
  name: string;
  baseUrl: string;
  process: ChildProcess;
  /** The next-server process's resident memory now, in bytes. */
  rss(): number;
  stop(): Promise<void>;
}

/** `next start` on one database file, mail to `smtpPort`; payments and uploads pointed at a closed port (no route here uses them). */
export async function startApp(name: string, o: { distDir: string; dbFile: string; smtpPort: number }): Promise<AppServer> {
  const closed = await freePort();
  const server = await startRunningNextServer(
    {
      distDir: o.distDir,
      env: {
        DATABASE_URL: `file:${o.dbFile}`,
        NEXTAUTH_SECRET: SECRET,
        SMTP_URL: `smtp://127.0.0.1:${o.smtpPort}`,
        STRIPE_SECRET_KEY: "",
        // A production server: no payment or upload service is reached here, so the fakes are named on purpose (lib/env.ts).
        COTTER_USE_FAKE_STRIPE: "1",
        COTTER_USE_FAKE_UPLOADTHING: "1",
        STRIPE_WEBHOOK_SECRET: "whsec_bench_only",
        FAKE_STRIPE_PORT: String(closed),
        UPLOADTHING_TOKEN: "",
        FAKE_UPLOADTHING_PORT: String(closed),
      },
    },
    90_000,
  );
  const pid = nextServerPid(server.child.pid!);
  return { name, baseUrl: server.url, process: server.child, rss: () => vmRss(pid), stop: () => server.stop() };
}

/** The process that serves requests: `next start` names it next-server; it may be a child of the one we started. */
function nextServerPid(rootPid: number): number {
  const children = new Map<number, number[]>();
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, "utf8");
      const ppid = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      children.set(ppid, [...(children.get(ppid) ?? []), Number(entry)]);
    } catch {
      // the process ended while we looked
    }
  }
  const family = [rootPid];
  for (let i = 0; i < family.length; i++) family.push(...(children.get(family[i]!) ?? []));
  const named = family.find((pid) => {
    const cmdline = existsSync(`/proc/${pid}/cmdline`) ? readFileSync(`/proc/${pid}/cmdline`, "utf8") : "";
    return cmdline.startsWith("next-server");
  });
  return named ?? rootPid;
}

function vmRss(pid: number): number {
  try {
    const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
    return match ? Number(match[1]) * 1024 : 0;
  } catch {
    return 0;
  }
}
