/** Next.js calls register() once per server process, before the first request (the framework's start-up hook). */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startUp } = await import("./lib/start-up");
  await startUp();
}
