import { SEVERITIES } from "@/lib/domain";
import { READING_CAUTION } from "@/lib/specs";
import { FindingCard, type FindingListItem } from "./finding-card";

export type { FindingListItem } from "./finding-card";

/**
 * A visit's findings, Out of service first, then Fix now, Plan for, Note
 * (newest first within each). Pages that show a verdict carry the caution line.
 * Takes what loadFindings() returns, from the server or from the API.
 */
export function FindingList({ findings, empty = "No findings posted yet." }: { findings: readonly FindingListItem[]; empty?: string }) {
  if (!findings.length) return <p className="text-ink-faint">{empty}</p>;
  const ordered = [...findings].sort(
    (a, b) => SEVERITIES.indexOf(a.severity) - SEVERITIES.indexOf(b.severity) || b.createdAt.localeCompare(a.createdAt),
  );
  const hasReadings = ordered.some((f) => f.readings.length > 0);
  return (
    <div className="flex flex-col gap-3" data-testid="finding-list">
      {hasReadings ? (
        <p role="note" className="border-l-4 border-ink pl-3 text-sm text-ink-soft" data-testid="reading-caution">
          {READING_CAUTION}
        </p>
      ) : null}
      {ordered.map((f) => (
        <FindingCard key={f.id} finding={f} />
      ))}
    </div>
  );
}
