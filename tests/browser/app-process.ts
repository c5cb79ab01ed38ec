import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { inject } from "vitest";
import { freePort } from "@/tests/support/ports";

const root = path.join(import.meta.dirname, "..", "..");

export interface AppProcess {
  url: string;
  child: ChildProcess;
  exited: Promise<number>;
  output(): string;
  /** Resolves "running" once the app answers its health check, or with the exit code if it stops first. */
  ready(timeoutMs?: number): Promise<number | "running">;
  stop(): Promise<void>;
}

/** A `next start` of the test build of our own, with exactly the environment given (plus PATH and the build's place). */
export async function startApp(env: Record<string, string>): Promise<AppProcess> {
  const port = await freePort();
  const child = spawn(path.join(root, "node_modules", ".bin", "next"), ["start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: root,
    env: { PATH: process.env.PATH ?? "", HOME: process.env.HOME ?? "", NEXT_DIST_DIR: inject("distDir"), NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout?.on("data", (d: Buffer) => (output += d.toString()));
  child.stderr?.on("data", (d: Buffer) => (output += d.toString()));
  const exited = new Promise<number>((resolve) => child.on("exit", (code) => resolve(code ?? -1)));
  const url = `http://127.0.0.1:${port}`;
  return {
    url,
    child,
    exited,
    output: () => output,
    async ready(timeoutMs = 30_000) {
      const deadline = Date.now() + timeoutMs;
      while (Date.now() < deadline) {
        const code = await Promise.race([exited, new Promise<null>((r) => setTimeout(() => r(null), 300))]);
        if (code !== null) return code;
        if (await fetch(`${url}/api/v1/health`).then((r) => r.ok, () => false)) return "running";
      }
      child.kill("SIGKILL");
      throw new Error(`the server neither started nor stopped:\n${output}`);
    },
    async stop() {
      if (child.exitCode === null) child.kill("SIGTERM");
      await exited;
    },
  };
}
