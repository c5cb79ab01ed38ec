import type { Request } from "autocannon";
import type { PoolLine } from "../big-db/open-visits";
import { countApproved, type Fixtures } from "./fixtures";
import { load, type LoadResult } from "./load";

export interface ApprovalsResult {
  rounds: LoadResult[];
  ok: number;
  refused: number;
  inDatabase: { lines: number; decisions: number };
}

/**
 * Approvals over HTTP: POST /api/v1/lines/:id/decision at `connections`,
 * every request a different proposed line at its current version, signed in
 * as the approver its visit was made for (within both signing limits and the
 * budget, so none is refused for a limit). A round is a fixed number of
 * requests (about `seconds` at the warm-up's rate), so every response is
 * counted; the database is counted afterwards.
 */
export async function runApprovals(
  baseUrl: string,
  dbFile: string,
  fixtures: Fixtures,
  pool: PoolLine[],
  o: { rounds: number; seconds: number; connections: number },
): Promise<ApprovalsResult> {
  const queue = [...pool];
  const sent: string[] = [];
  const next = (request: Request) => {
    const line = queue.shift();
    if (!line) return null;
    sent.push(line.lineId);
    const cookie = fixtures.cookieOf.get(line.approverId);
    if (!cookie) throw new Error(`no session for approver ${line.approverId}`);
    return {
      ...request,
      method: "POST" as const,
      path: `/api/v1/lines/${line.lineId}/decision`,
      headers: { cookie, "content-type": "application/json" },
      body: JSON.stringify({ decision: "approve", expectedVersion: line.version }),
    };
  };
  const round = (amount: number) => load({ url: baseUrl, connections: o.connections, amount, setupRequest: next });

  // Warm-up, also the first estimate of the rate.
  const warm = await round(Math.min(200, Math.floor(queue.length / (o.rounds + 2))));
  const rounds: LoadResult[] = [];
  let rate = warm.rps;
  for (let i = 0; i < o.rounds; i++) {
    // A few more lines than requests: each connection builds one request ahead.
    const room = Math.floor(queue.length / (o.rounds - i)) - 2 * o.connections;
    const amount = Math.max(o.connections, Math.min(room, Math.round(rate * o.seconds)));
    const r = await round(amount);
    rounds.push(r);
    rate = r.rps;
  }
  const all = [warm, ...rounds];
  return {
    rounds,
    ok: all.reduce((s, r) => s + r.ok, 0),
    refused: all.reduce((s, r) => s + r.non2xx + r.errors, 0),
    inDatabase: await countApproved(dbFile, sent),
  };
}
