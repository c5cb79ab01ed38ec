import type { IntermittentConcern, listOccurrences, OccurrenceJson } from "@/db/queries/occurrences";

/** GET /api/v1/units/:id/occurrences, as the browser receives it. */
export type OccurrenceLog = Awaited<ReturnType<typeof listOccurrences>>;
export type OccurrenceEntry = OccurrenceJson;
export type { IntermittentConcern };

export function logUrl(unitId: string, concernId?: string | null): string {
  const q = new URLSearchParams({ limit: "200" });
  if (concernId) q.set("concernId", concernId);
  return `/api/v1/units/${unitId}/occurrences?${q.toString()}`;
}
