import { LINE_STATE_LABELS, type LineState } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";
import { formatCents } from "@/lib/money";

const STYLE: Record<LineState, string> = {
  draft: "border-dashed border-ink-faint text-ink-soft",
  proposed: "border-rust text-rust-deep bg-rust-wash",
  approved: "border-ink text-ink",
  in_progress: "border-ink text-ink",
  done: "border-ink bg-ink text-paper",
  declined: "border-ink-faint text-ink-faint line-through decoration-1",
  held: "border-ink-soft text-ink-soft",
};

export function LineStatePill({ state }: { state: LineState }) {
  return (
    <span className={`inline-block rounded-full border-2 px-2 py-0.5 text-xs font-semibold whitespace-nowrap ${STYLE[state]}`} data-state={state}>
      {LINE_STATE_LABELS[state]}
    </span>
  );
}

export interface DecisionInfo {
  by: string;
  at: string;
  decision: "approve" | "decline" | "hold";
  amountCents: number;
  note: string;
  lineVersion?: number;
}

const VERB = { approve: "Approved", decline: "Declined", hold: "Held" } as const;

/** Who decided, when, at what amount: the record both sides can see. */
export function DecisionLine({ decision }: { decision: DecisionInfo | null }) {
  if (!decision) return null;
  return (
    <p className="text-xs text-ink-faint">
      {VERB[decision.decision]} by {decision.by}, {formatDateTime(decision.at)}, at {formatCents(decision.amountCents)}
      {decision.lineVersion ? ` (version ${decision.lineVersion})` : ""}
      {decision.note ? ` — “${decision.note}”` : ""}
    </p>
  );
}
