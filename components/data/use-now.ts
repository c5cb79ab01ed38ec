"use client";

import { useEffect, useState } from "react";

/**
 * The current time as state, ticking every interval, so "late" and "3 min ago" stay true on a
 * page left open. Pass the server's clock at render (`startAt`): the first render in the browser
 * then draws exactly what the server drew, and the clock starts ticking only after hydration
 * (a running clock drawn from Date.now() on both sides never matches: React error #418).
 */
export function useNow(intervalMs = 30_000, startAt?: number): number {
  const [now, setNow] = useState(() => startAt ?? Date.now());
  useEffect(() => {
    // The first tick comes at once (not after a whole interval), from the timer, not the effect body.
    const first = setTimeout(() => setNow(Date.now()), 0);
    const timer = setInterval(() => setNow(Date.now()), intervalMs);
    return () => {
      clearTimeout(first);
      clearInterval(timer);
    };
  }, [intervalMs]);
  return now;
}
