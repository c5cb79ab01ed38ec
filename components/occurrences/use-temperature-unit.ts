"use client";

import { useCallback, useSyncExternalStore } from "react";
import type { TemperatureUnit } from "@/lib/occurrences/temperature";

const KEY = "cotter:temperature-unit";
const listeners = new Set<() => void>();

function read(): TemperatureUnit {
  try {
    return window.localStorage.getItem(KEY) === "C" ? "C" : "F";
  } catch {
    return "F";
  }
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** °F or °C as this person last chose, remembered on the device; °F until they choose. */
export function useTemperatureUnit(): [TemperatureUnit, (unit: TemperatureUnit) => void] {
  const unit = useSyncExternalStore(subscribe, read, () => "F" as const);
  const set = useCallback((next: TemperatureUnit) => {
    try {
      window.localStorage.setItem(KEY, next);
    } catch {
      // private mode: the choice lasts for this page only
    }
    for (const l of listeners) l();
  }, []);
  return [unit, set];
}
