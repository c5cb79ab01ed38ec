import { DECISION_LABELS } from "../domain";
import { formatCents } from "../money";
import type { LineChange } from "./types";

/** One sentence for the audit note and the writer's e-mail: "approve 2 lines ($310.00), decline 1 line ($45.00)". */
export function describeDecisions(changes: LineChange[]): string {
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
