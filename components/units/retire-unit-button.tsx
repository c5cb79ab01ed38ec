"use client";

import { ToggleActionButton } from "@/components/ui/toggle-action-button";
import { retireUnitAction } from "@/lib/server/actions/units";

/** A retired unit keeps its history and leaves every list; its number is free for a replacement. */
export function RetireUnitButton({ unitId, retired }: { unitId: string; retired: boolean }) {
  return <ToggleActionButton on={retired} labels={{ turnOn: "Retire this unit", turnOff: "Put the unit back in service" }} run={(next) => retireUnitAction({ unitId, retired: next })} />;
}
