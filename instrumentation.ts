/** Next.js calls register() once per server process, before the first request (the framework's start-up hook). */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startUp } = await import("./lib/server/start-up");
  await startUp();
  // Running diagnosis clocks stop by themselves at their time box and people are told, even when
  // nobody has the page open: the watcher picks up where the last process left off.
  const { scheduleTimeBoxWatch } = await import("./lib/server/notifications/time-box-watch");
  await scheduleTimeBoxWatch().catch((error: unknown) => console.error("time box watch could not start", error));
}
