import Link from "next/link";
import { ButtonLink } from "@/components/ui/button";
import { watchedConcerns } from "@/db/queries/intermittent-concerns";
import type { SessionUser } from "@/lib/auth/session-user";
import { formatDate } from "@/lib/format";
import { daysSincePhrase } from "@/lib/occurrences/pattern";

/**
 * Faults the shop has asked the fleet to watch for, each with a big "Log an
 * occurrence" button, and the shop's conclusion on ones closed lately.
 */
export async function FleetWatchList({ user, unitId, compact = false }: { user: SessionUser; unitId?: string; compact?: boolean }) {
  const { open, closed } = await watchedConcerns(user, { unitId });
  if (compact && !open.length && !closed.length) return null;
  return (
    <section
      aria-labelledby="watch-heading"
      className={`flex flex-col gap-3 ${unitId ? "rounded-card border border-rule bg-paper-card p-4" : compact ? "mb-6" : ""}`}
      data-testid="fleet-watch-list"
    >
      <h2 id="watch-heading" className={unitId ? "text-lg font-bold" : "text-xl font-bold"}>
        {unitId ? "Occurrence log" : "Problems to watch for"}
      </h2>
      {open.length === 0 ? <p className="text-ink-faint">The shop has not asked you to watch for anything{unitId ? " on this unit" : ""}.</p> : null}
      <ul className={`grid gap-3 ${unitId ? "" : "md:grid-cols-2"}`}>
        {open.map((c) => {
          return (
            <li key={c.id} className="flex flex-col gap-2 rounded-card border-2 border-ink bg-paper-card p-4" data-testid="watched-concern">
              <p className="text-sm font-semibold tracking-wide text-ink-faint uppercase">{c.unitNumber}</p>
              <p className="font-bold">{c.complaint}</p>
              {c.recordHint && (unitId || !compact) ? <p className="text-sm">
                  <span className="font-semibold">What to record:</span> {c.recordHint}
                </p> : null}
              <p className="figures text-sm text-ink-faint">
                {c.count} logged{c.count ? ` · last one ${daysSincePhrase(c.daysSinceLast)}` : ""}
              </p>
              <ButtonLink href={`/fleet/units/${c.unitId}/log`} className="min-h-14 w-full text-lg">
                Log an occurrence
              </ButtonLink>
            </li>
          );
        })}
      </ul>
      {closed.length ? (
        <ul className="flex flex-col gap-2">
          {closed.map((c) => (
            <li key={c.id} className="rounded-card border border-rule bg-paper-card p-3" data-testid="closed-concern">
              <p className="text-sm text-ink-faint">
                {c.unitNumber} · closed {formatDate(c.closedAt)}
              </p>
              <p className="font-semibold">{c.complaint}</p>
              <p>
                <span className="font-semibold">The shop found:</span> {c.conclusion}
              </p>
              <Link href={`/fleet/units/${c.unitId}/log`} className="text-sm">
                See the log
              </Link>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
