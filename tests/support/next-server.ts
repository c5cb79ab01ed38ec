import { spawn, type ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { freePort } from "./ports";

export const root = path.join(import.meta.dirname, "..", "..");
// A separate build directory per checkout or worktree lets test runs sit side by side.
export const testDistDir = process.env.COTTER_TEST_DIST_DIR ?? ".next-test";

/**
 * The heap ceiling `npm start` gives the server (package.json, COTTER_HEAP_MB), read from there
 * so the tests and the benchmark run the app as production does.
 */
export function heapFlag(): string {
  const start = (JSON.parse(readFileSync(path.join(root, "package.json"), "utf8")) as { scripts: { start: string } }).scripts.start;
  const fallback = /COTTER_HEAP_MB:-(\d+)/.exec(start)?.[1];
  if (!fallback) throw new Error("package.json's start script no longer sets the heap ceiling");
  return `--max-old-space-size=${process.env.COTTER_HEAP_MB ?? fallback}`;
}

export interface NextServer {
  url: string;
  child: ChildProcess;
  exited: Promise<number>;
  /** What the server printed (the last 20 kB), for a test that checks a start-up message or explains a failure. */
  output(): string;
  /** Resolves "running" once the app answers its health check, or with the exit code if it stops first. */
  ready(timeoutMs?: number): Promise<number | "running">;
  stop(): Promise<void>;
}

export interface NextServerOptions {
  /** The build to serve (NEXT_DIST_DIR). */
  distDir: string;
  env: Record<string, string>;
  /**
   * Start from this process's environment (the usual case), or from nothing but
   * PATH and HOME, for a test of exactly what the app demands at start.
   */
  inheritEnv?: boolean;
  port?: number;
}

/**
 * `next start` of a build on a port of its own: the one way the browser tests,
 * the start-up tests and the benchmark run the app. Started through node itself,
 * so the child is the server whose memory the benchmark reads.
 */
export async function startNextServer(o: NextServerOptions): Promise<NextServer> {
  const port = o.port ?? (await freePort());
  const url = `http://127.0.0.1:${port}`;
  // The app's own links point at where it runs, unless the test is about an environment given in full.
  const base = o.inheritEnv === false ? { PATH: process.env.PATH ?? "", HOME: process.env.HOME ?? "" } : { ...process.env, NEXTAUTH_URL: url };
  const child = spawn(process.execPath, [heapFlag(), path.join(root, "node_modules", "next", "dist", "bin", "next"), "start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: root,
    env: { ...base, NODE_ENV: "production", NEXT_DIST_DIR: o.distDir, NEXT_TELEMETRY_DISABLED: "1", ...o.env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  const keep = (d: Buffer) => {
    output = (output + d.toString()).slice(-20_000);
  };
  child.stdout?.on("data", keep);
  child.stderr?.on("data", keep);
  const exited = new Promise<number>((resolve) => child.on("exit", (code) => resolve(code ?? -1)));
  return {
    url,
    child,
    exited,
    output: () => output,
    async ready(timeoutMs = 60_000) {
      const deadline = Date.now() + timeoutMs;
      while (Date.now() < deadline) {
        const code = await Promise.race([exited, new Promise<null>((r) => setTimeout(() => r(null), 300))]);
        if (code !== null) return code;
        if (await fetch(`${url}/api/v1/health`).then((r) => r.ok, () => false)) return "running";
      }
      child.kill("SIGKILL");
      throw new Error(`the server at ${url} neither answered nor stopped within ${timeoutMs} ms:\n${output}`);
    },
    async stop() {
      if (child.exitCode === null) child.kill("SIGTERM");
      await exited;
    },
  };
}

/** Starts the server and waits until it answers; a server that stops instead is an error with its output. */
export async function startRunningNextServer(o: NextServerOptions, timeoutMs?: number): Promise<NextServer> {
  const server = await startNextServer(o);
  const state = await server.ready(timeoutMs);
  if (state !== "running") throw new Error(`next start exited with ${state}:\n${server.output()}`);
  return server;
}
