"use client";

import { useEffect, useState } from "react";

/** The current time as state, ticking every interval, so "late" and "3 min ago" stay true on a page left open. */
export function useNow(intervalMs = 30_000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), intervalMs);
    return () => clearInterval(timer);
  }, [intervalMs]);
  return now;
}
