import { VERDICT_LABELS, type Verdict } from "@/lib/domain";

/**
 * The verdict in words, with a small gauge: a needle left of, on, or past the
 * limit line. Beyond carries the accent and a heavy border; no colour-only cue.
 */
export function VerdictMark({ verdict }: { verdict: Verdict }) {
  const needle = verdict === "within" ? 6 : verdict === "at_limit" ? 14 : 21;
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-full px-2 py-0.5 text-xs font-bold whitespace-nowrap ${
        verdict === "beyond"
          ? "border-2 border-rust-deep bg-rust-wash text-rust-deep"
          : verdict === "at_limit"
            ? "border-2 border-dashed border-ink text-ink"
            : "border border-rule-strong text-ink-soft"
      }`}
      data-verdict={verdict}
    >
      <svg width="26" height="12" viewBox="0 0 26 12" aria-hidden>
        <line x1="1" y1="6" x2="25" y2="6" stroke="currentColor" strokeWidth="1.5" opacity="0.5" />
        <line x1="14" y1="0" x2="14" y2="12" stroke="currentColor" strokeWidth="2" />
        <circle cx={needle} cy="6" r="3.2" fill="currentColor" />
      </svg>
      {VERDICT_LABELS[verdict]}
    </span>
  );
}
