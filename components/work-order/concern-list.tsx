export interface ConcernView {
  id: string;
  complaint: string;
  cause: string;
  correction: string;
  intermittent: boolean;
  recordHint: string;
}

/** The trade's three Cs for each concern on the visit. */
export function ConcernList({ concerns }: { concerns: ConcernView[] }) {
  if (!concerns.length) return <p className="text-ink-faint">No concerns written yet.</p>;
  return (
    <ol className="flex flex-col gap-3">
      {concerns.map((c, i) => (
        <li key={c.id} className="rounded-card border border-rule bg-paper p-3">
          <p className="font-bold">
            {i + 1}. {c.complaint}
            {c.intermittent ? (
              <span className="ml-2 rounded-full border border-ink px-2 py-0.5 text-xs font-semibold">Intermittent</span>
            ) : null}
          </p>
          <dl className="mt-1 grid grid-cols-[6.5rem_1fr] gap-x-2 text-sm">
            <dt className="text-ink-faint">Cause</dt>
            <dd>{c.cause || "Not found yet"}</dd>
            <dt className="text-ink-faint">Correction</dt>
            <dd>{c.correction || "—"}</dd>
          </dl>
        </li>
      ))}
    </ol>
  );
}
