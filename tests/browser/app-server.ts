import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { freePort } from "@/tests/support/ports";

export const root = path.join(import.meta.dirname, "..", "..");
// A separate build directory per checkout or worktree lets test runs sit side by side.
export const distDir = process.env.COTTER_TEST_DIST_DIR ?? ".next-test";

export async function waitForHealth(url: string, server: ChildProcess, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`app server exited with ${server.exitCode}`);
    try {
      const res = await fetch(`${url}/api/v1/health`);
      if (res.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`app server did not answer at ${url} within ${timeoutMs} ms`);
}

/** `next start` of the test build on a port of its own, with the environment given; resolves once it answers. */
export async function startAppServer(env: Record<string, string>, port?: number): Promise<{ url: string; stop(): void }> {
  port ??= await freePort();
  const url = `http://127.0.0.1:${port}`;
  const server = spawn(path.join(root, "node_modules", ".bin", "next"), ["start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: root,
    env: { ...process.env, NEXT_DIST_DIR: distDir, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production", NEXTAUTH_URL: url, ...env },
    stdio: ["ignore", "inherit", "inherit"],
  });
  await waitForHealth(url, server);
  return { url, stop: () => void server.kill("SIGTERM") };
}
