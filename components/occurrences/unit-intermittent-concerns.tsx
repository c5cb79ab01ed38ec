import Link from "next/link";
import { Card, CardTitle } from "@/components/ui/card";
import { watchedConcerns } from "@/db/queries/intermittent-concerns";
import { listOccurrences } from "@/db/queries/occurrences";
import { requireUser } from "@/lib/server/auth/current-user";
import { formatDate } from "@/lib/format";
import { daysSincePhrase, summarizePattern } from "@/lib/occurrences/pattern";

async function load(unitId: string) {
  const user = await requireUser();
  const [watched, log] = await Promise.all([watchedConcerns(user, { unitId }), listOccurrences(user, unitId, { limit: 200 })]);
  const now = Date.now();
  return {
    ...watched,
    loose: log.occurrences.filter((o) => o.concernId === null),
    summaries: new Map(watched.open.map((c) => [c.id, summarizePattern(log.occurrences.filter((o) => o.concernId === c.id), { now })])),
  };
}

/** On the shop's unit page: the intermittent concerns open on this unit, with the pattern so far. */
export async function UnitIntermittentConcerns({ unitId }: { unitId: string }) {
  const { open, closed, loose, summaries } = await load(unitId);
  if (!open.length && !closed.length && !loose.length) return null;
  return (
    <Card id="occurrences" data-testid="unit-intermittent-concerns">
      <CardTitle>Intermittent concerns</CardTitle>
      {open.length === 0 ? <p className="text-ink-faint">None open.</p> : null}
      <ul className="flex flex-col gap-3">
        {open.map((c) => {
          const summary = summaries.get(c.id);
          return (
            <li key={c.id} className="rounded-card border-2 border-ink bg-paper p-3">
              <Link href={`/concerns/${c.id}`} className="font-bold">
                {c.complaint}
              </Link>
              <p className="mt-1 text-sm">{summary?.headline}</p>
              <p className="figures text-sm text-ink-faint">
                {c.count} logged · last one {daysSincePhrase(summary?.daysSinceLast ?? null)}
              </p>
            </li>
          );
        })}
      </ul>
      {loose.length ? (
        <p className="mt-3 text-sm">
          {loose.length} {loose.length === 1 ? "entry" : "entries"} logged by the fleet with no intermittent concern open. Mark a concern
          intermittent on the unit&apos;s work order and they attach to it.
        </p>
      ) : null}
      {closed.length ? (
        <ul className="mt-3 flex flex-col gap-1 text-sm">
          {closed.map((c) => (
            <li key={c.id}>
              <Link href={`/concerns/${c.id}`}>{c.complaint}</Link>{" "}
              <span className="text-ink-faint">closed {formatDate(c.closedAt)}: {c.conclusion}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </Card>
  );
}
