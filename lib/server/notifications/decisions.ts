import "server-only";
import type { Tx } from "@/db/client";
import type { TimeBoxNoticeDue } from "@/db/queries/time-box-stops";
import type { SessionUser } from "@/lib/auth/session-user";
import { describeDecisions, type BatchOk } from "@/lib/estimate";
import { queueDecisionMade } from "./estimate";
import { queueTimeBoxNotices } from "./time-box";
import { scheduleTimeBoxWatch } from "./time-box-watch";

/** Passed to decide(): in the decision's own transaction, queue the writer's e-mail about it (and any time-box notice it made due). */
export function decisionNotice(user: SessionUser) {
  return async (tx: Tx, { result, wo, timeBoxNotices }: { result: BatchOk; wo: { id: string }; timeBoxNotices: TimeBoxNoticeDue[] }): Promise<void> => {
    const stillPending = result.lines.filter((l) => l.state === "proposed").length;
    await queueDecisionMade(tx, wo.id, { approverName: user.name, summary: describeDecisions(result.changes), stillPending });
    await queueTimeBoxNotices(tx, timeBoxNotices);
  };
}

/** After a decision commits: a decided diagnosis line (or extension) moves when running clocks stop. */
export async function afterDecision(result: BatchOk): Promise<void> {
  if (result.changes.some((c) => result.lines.find((l) => l.id === c.lineId)?.isDiagnosis)) {
    await scheduleTimeBoxWatch().catch((e: unknown) => console.error("time box watch failed", e));
  }
}
