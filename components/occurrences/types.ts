import type { IntermittentConcern, listOccurrences, OccurrenceJson } from "@/db/queries/occurrences";

/** GET /api/v1/units/:id/occurrences, as the browser receives it. */
export type OccurrenceLog = Awaited<ReturnType<typeof listOccurrences>>;
export type OccurrenceEntry = OccurrenceJson;
export type { IntermittentConcern };

/** The log's API address: 200 entries (the API's most) for a concern's pattern, or one page of the log. */
export function logUrl(unitId: string, concernId?: string | null, page?: { limit: number; cursor?: string }): string {
  const q = new URLSearchParams({ limit: String(page?.limit ?? 200) });
  if (concernId) q.set("concernId", concernId);
  if (page?.cursor) q.set("cursor", page.cursor);
  return `/api/v1/units/${unitId}/occurrences?${q.toString()}`;
}
