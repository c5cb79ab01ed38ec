import "server-only";
import type { Tx } from "@/db/client";
import type { Decided } from "@/db/queries/decisions";
import type { SessionUser } from "@/lib/auth/session-user";
import type { BatchOk } from "@/lib/estimate";
import { queueDecisionMade } from "./estimate";
import { queueTimeBoxNotices } from "./time-box";
import { scheduleTimeBoxWatch } from "./time-box-watch";

/** Passed to decide(): in the decision's own transaction, queue the writer's e-mail about it (and any time-box notice it made due), from what the decision loaded. */
export function decisionNotice(user: SessionUser) {
  return async (tx: Tx, { result, wo, unitNumber, summary, timeBoxNotices }: Decided): Promise<void> => {
    const stillPending = result.lines.filter((l) => l.state === "proposed").length;
    await queueDecisionMade(tx, { ...wo, unitNumber }, { approverName: user.name, summary, stillPending });
    await queueTimeBoxNotices(tx, timeBoxNotices);
  };
}

/** After a decision commits: a decided diagnosis line (or extension) moves when running clocks stop. */
export async function afterDecision(result: BatchOk): Promise<void> {
  if (result.changes.some((c) => result.lines.find((l) => l.id === c.lineId)?.isDiagnosis)) {
    await scheduleTimeBoxWatch().catch((e: unknown) => console.error("time box watch failed", e));
  }
}
