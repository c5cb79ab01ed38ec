"use client";

import { useRouter } from "next/navigation";
import { useEffect } from "react";
import { LIVE_REFRESH_MS } from "./fetcher";

/**
 * Keeps a server-rendered page fresh: asks the server to render it again every
 * LIVE_REFRESH_MS and when the tab comes back into view. The page's data then
 * reaches the browser once, as rendered output, with no second copy for a client cache.
 */
export function LiveRefresh({ intervalMs = LIVE_REFRESH_MS }: { intervalMs?: number }) {
  const router = useRouter();
  useEffect(() => {
    const timer = setInterval(() => {
      if (document.visibilityState === "visible") router.refresh();
    }, intervalMs);
    const onVisible = () => {
      if (document.visibilityState === "visible") router.refresh();
    };
    document.addEventListener("visibilitychange", onVisible);
    return () => {
      clearInterval(timer);
      document.removeEventListener("visibilitychange", onVisible);
    };
  }, [intervalMs, router]);
  return null;
}
