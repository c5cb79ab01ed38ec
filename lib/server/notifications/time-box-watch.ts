import "server-only";
import { getDb, writeTx } from "@/db/client";
import { nextTimeBoxInstant, settleTimeBoxes, type TimeBoxNoticeDue } from "@/db/queries/time-box-stops";
import { nowIso } from "@/lib/ids";
import { queueTimeBoxNotices } from "./time-box";

/*
 * A clock with nobody watching must stop at the right moment and the people told. The stop
 * itself needs no timer (every read counts a running clock only up to its stored stop time); the
 * watcher closes it in the database and sends the 80 % and 100 % notices when they fall due.
 * One timer per server process, set for the next due instant; started at boot
 * (instrumentation.ts) and again after every write that changes a clock or a box.
 */

const holder = globalThis as unknown as { __cotterTimeBoxWatch?: { timer: NodeJS.Timeout | null; at: number | null } };
const state = (holder.__cotterTimeBoxWatch ??= { timer: null, at: null });
// setTimeout holds at most ~24.8 days; look again at least daily.
const MAX_WAIT_MS = 86_400_000;

/** Settles every box whose time has come, queues the notices that fell due, and sets the timer for the next one. */
export async function checkTimeBoxes(): Promise<TimeBoxNoticeDue[]> {
  const notices = await writeTx(async (tx) => {
    const due = await settleTimeBoxes(tx, nowIso());
    await queueTimeBoxNotices(tx, due);
    return due;
  });
  await scheduleTimeBoxWatch();
  return notices;
}

export async function scheduleTimeBoxWatch(): Promise<void> {
  const next = await nextTimeBoxInstant(getDb(), nowIso());
  if (next === null) {
    if (state.timer) clearTimeout(state.timer);
    state.timer = null;
    state.at = null;
    return;
  }
  if (state.timer && state.at !== null && state.at <= next) return;
  if (state.timer) clearTimeout(state.timer);
  state.at = next;
  const wait = Math.min(MAX_WAIT_MS, Math.max(0, next - Date.now()) + 250);
  state.timer = setTimeout(() => {
    state.timer = null;
    state.at = null;
    checkTimeBoxes().catch((e: unknown) => console.error("time box watch failed", e));
  }, wait);
  state.timer.unref?.();
}
