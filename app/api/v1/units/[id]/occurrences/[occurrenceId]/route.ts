import { getOccurrence, updateOccurrence } from "@/db/queries/occurrences";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { occurrenceParams as params } from "@/lib/validation/api-queries";
import { occurrencePatch } from "@/lib/validation/occurrence";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.logOccurrence, params }, async ({ user, params: p }) => {
  const row = await getOccurrence(user, p.id, p.occurrenceId);
  if (!row) throw notFound("That entry");
  return row;
});

/** Corrects an entry: its author, or shop staff; anyone else in the account gets 403. */
export const PATCH = apiRoute({ roles: CAN.logOccurrence, params, body: occurrencePatch }, async ({ user, params: p, body }) =>
  (await updateOccurrence(user, p.id, p.occurrenceId, body)) ?? {},
);
