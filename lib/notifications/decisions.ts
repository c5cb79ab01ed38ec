import type { Tx } from "@/db/client";
import { describeDecisions } from "@/db/queries/decisions";
import type { SessionUser } from "@/lib/auth/session-user";
import type { BatchOk } from "@/lib/estimate";
import { queueDecisionMade } from "./estimate";

/** Passed to decide(): in the decision's own transaction, queue the writer's e-mail about it. */
export function decisionNotice(user: SessionUser) {
  return async (tx: Tx, { result, wo }: { result: BatchOk; wo: { id: string } }): Promise<void> => {
    const stillPending = result.lines.filter((l) => l.state === "proposed").length;
    await queueDecisionMade(tx, wo.id, { approverName: user.name, summary: describeDecisions(result.changes), stillPending });
  };
}
