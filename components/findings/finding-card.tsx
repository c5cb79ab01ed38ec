import type { Severity } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";
import { READING_CAUTION } from "@/lib/specs";
import { MarkdownNote } from "./markdown-note";
import { PhotoStrip, type PhotoView } from "./photo-strip";
import { ReadingList, type ReadingView } from "./reading-list";
import { SeverityMark } from "./severity-mark";

/** What FindingList needs of a finding; loadFindings() and GET …/findings return this shape and more. */
export interface FindingListItem {
  id: string;
  title: string;
  severity: Severity;
  noteMarkdown: string;
  createdAt: string;
  createdBy: string | null;
  photos: readonly PhotoView[];
  readings: readonly ReadingView[];
}

export const OUT_OF_SERVICE_LINE = "Out of service: keep this unit off the road until this is repaired.";

export function FindingCard({ finding }: { finding: FindingListItem }) {
  const oos = finding.severity === "out_of_service";
  return (
    <article
      className={`flex flex-col gap-2 rounded-card bg-paper-card p-3 ${oos ? "border-[3px] border-rust-deep" : "border border-rule"}`}
      data-testid="finding"
      data-severity={finding.severity}
      aria-labelledby={`finding-${finding.id}`}
    >
      <header className="flex flex-col gap-1">
        <SeverityMark severity={finding.severity} />
        <h3 id={`finding-${finding.id}`} className="text-lg leading-snug font-bold">
          {finding.title}
        </h3>
        <p className="text-xs text-ink-faint">
          {finding.createdBy ?? "The shop"} · <time dateTime={finding.createdAt}>{formatDateTime(finding.createdAt)}</time>
        </p>
      </header>
      {oos ? (
        <p role="note" className="rounded-card bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep" data-testid="oos-caution">
          {OUT_OF_SERVICE_LINE} {READING_CAUTION}
        </p>
      ) : null}
      <MarkdownNote markdown={finding.noteMarkdown} />
      <PhotoStrip photos={finding.photos} title={finding.title} />
      <ReadingList readings={finding.readings} />
    </article>
  );
}
