import { DECISION_LABELS } from "../domain";
import { formatCents } from "../money";
import type { LineChange } from "./types";

/** "approve 2 lines ($410.00), decline 1 line ($95.00)": the timeline's and the writer's e-mail's words for a batch. */
export function describeDecisions(changes: readonly LineChange[]): string {
  const parts = (["approve", "decline", "hold"] as const)
    .map((d) => {
      const picked = changes.filter((c) => c.record.decision === d);
      if (!picked.length) return null;
      const total = picked.reduce((s, c) => s + c.record.amountCents, 0);
      return `${DECISION_LABELS[d].toLowerCase()} ${picked.length} line${picked.length === 1 ? "" : "s"} (${formatCents(total)})`;
    })
    .filter(Boolean);
  return parts.join(", ");
}
