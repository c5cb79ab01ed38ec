// Next.js calls register() once when a server process starts.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // Running diagnosis clocks stop by themselves at their time box and people are told, even when
  // nobody has the page open: the watcher picks up where the last process left off.
  const { scheduleTimeBoxWatch } = await import("@/lib/notifications/time-box-watch");
  await scheduleTimeBoxWatch().catch((error: unknown) => console.error("time box watch could not start", error));
}
