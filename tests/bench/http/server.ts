import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { SMTPServer } from "smtp-server";

export const ROOT = path.join(import.meta.dirname, "..", "..", "..");
export const SECRET = "bench-secret-bench-secret-bench-secret!!";

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

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
  const port = await freePort();
  const closed = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, [path.join(ROOT, "node_modules", "next", "dist", "bin", "next"), "start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_DIST_DIR: o.distDir,
      NEXT_TELEMETRY_DISABLED: "1",
      DATABASE_URL: `file:${o.dbFile}`,
      NEXTAUTH_URL: baseUrl,
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
    stdio: ["ignore", "ignore", "pipe"],
  });
  let errors = "";
  child.stderr?.on("data", (d: Buffer) => {
    errors = (errors + d.toString()).slice(-4_000);
  });
  await waitForHealth(baseUrl, child, () => errors);
  const pid = nextServerPid(child.pid!);
  return {
    name,
    baseUrl,
    process: child,
    rss: () => vmRss(pid),
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once("exit", () => resolve());
        child.kill("SIGTERM");
      }),
  };
}

async function waitForHealth(url: string, child: ChildProcess, errors: () => string, timeoutMs = 90_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`next start exited with ${child.exitCode}:\n${errors()}`);
    try {
      if ((await fetch(`${url}/api/v1/health`)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`next start did not answer at ${url} within ${timeoutMs} ms`);
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
