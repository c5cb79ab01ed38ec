import type { BatchOk } from "@/lib/estimate";
import type { SessionUser } from "@/lib/auth/session-user";
import { describeDecisions } from "@/db/queries/decisions";
import { deliverLater } from "@/lib/mail/deliver";
import { notifyDecisionMade } from "./estimate";
import { scheduleTimeBoxWatch } from "./time-box-watch";

/** After a decision commits: tell the writer, outside the request's critical path. */
export function afterDecision(user: SessionUser, workOrderId: string, result: BatchOk): Promise<void> {
  const stillPending = result.lines.filter((l) => l.state === "proposed").length;
  // An approved extension moves when the running clocks stop.
  if (result.changes.some((c) => result.lines.find((l) => l.id === c.lineId)?.isDiagnosis)) {
    void scheduleTimeBoxWatch().catch((e: unknown) => console.error("time box watch failed", e));
  }
  return deliverLater(() => notifyDecisionMade(workOrderId, user.name, describeDecisions(result.changes), stillPending));
}
