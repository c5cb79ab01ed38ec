import type { Cents } from "../money";
import { lineAmountOf, priceEstimate, type ApiTotals, type EstimatePricing } from "./pricing";
import type {
  AccountSettings,
  DecisionRecord,
  EstimateLine,
  LineChange,
  LineState,
  Refusal,
  ShopSettings,
} from "./types";

/** A batch succeeded: write every change and record, in one transaction. */
export interface BatchOk {
  ok: true;
  changes: LineChange[];
  /** All the work order's lines after the batch, in input order. */
  lines: EstimateLine[];
  pricing: EstimatePricing;
  totals: ApiTotals;
}

export type WithLine<T> = T & { lineId: string };

export type LineRefusal =
  | WithLine<Refusal<"not_found", Record<string, never>>>
  | WithLine<Refusal<"stale_version", { expectedVersion: number; currentVersion: number }>>
  | WithLine<Refusal<"not_pending", { amountCents: Cents }>>;

export interface BatchStep {
  lineId: string;
  expectedVersion: number;
}

/** The new stored fields of a line that passed every check. */
export interface Outcome {
  state: LineState;
  approvedByUserId: string | null;
  byStanding: boolean;
  approvedAmountCents: Cents | null;
  record: Pick<DecisionRecord, "decision" | "note" | "byUserId" | "byStanding">;
}

const STATE_WORDS: Record<LineState, string> = {
  draft: "still a draft",
  proposed: "waiting for a decision",
  approved: "already approved",
  declined: "already declined",
  held: "already held for later",
  in_progress: "already being worked on",
  done: "already done",
};

/**
 * Runs steps in order over a working copy of the lines; the first refusal
 * ends the batch and nothing is returned to write (all or none). `decide`
 * sees each line after the earlier steps of the same batch, so approvals add
 * up and a line named twice meets its own bumped version.
 */
export function runBatch<S extends BatchStep, R extends WithLine<Refusal<string, unknown>>>(args: {
  workOrderNumber: string;
  lines: readonly EstimateLine[];
  shop: ShopSettings;
  account: AccountSettings;
  steps: readonly S[];
  canDecide: (state: LineState) => boolean;
  decide: (line: EstimateLine, amountCents: Cents, step: S) => Outcome | R;
}): BatchOk | LineRefusal | R {
  const { workOrderNumber, lines, steps } = args;
  const working = new Map<string, EstimateLine>();
  for (const line of lines) working.set(line.id, line);
  const amounts = new Map<string, Cents>();
  const changes: LineChange[] = [];

  for (const step of steps) {
    const { lineId } = step;
    const line = working.get(lineId);
    if (line === undefined) {
      return { ok: false, code: "not_found", lineId, detail: `there is no line ${lineId} on ${workOrderNumber}`, amounts: {} };
    }
    if (line.version !== step.expectedVersion) {
      return {
        ok: false,
        code: "stale_version",
        lineId,
        detail:
          `this line changed since you saw it (you saw version ${step.expectedVersion}, it is now ` +
          `version ${line.version}); reload ${workOrderNumber} and decide again`,
        amounts: { expectedVersion: step.expectedVersion, currentVersion: line.version },
      };
    }
    let amountCents = amounts.get(lineId);
    if (amountCents === undefined) {
      amountCents = lineAmountOf(line);
      amounts.set(lineId, amountCents);
    }
    if (!args.canDecide(line.state)) {
      return {
        ok: false,
        code: "not_pending",
        lineId,
        detail: `this line is ${STATE_WORDS[line.state]}, so it cannot be decided now`,
        amounts: { amountCents },
      };
    }
    const outcome = args.decide(line, amountCents, step);
    if ("ok" in outcome) return outcome;
    const version = line.version + 1;
    working.set(lineId, {
      ...line,
      state: outcome.state,
      version,
      approvedByUserId: outcome.approvedByUserId,
      byStanding: outcome.byStanding,
      approvedAmountCents: outcome.approvedAmountCents,
    });
    changes.push({
      lineId,
      fromState: line.state,
      state: outcome.state,
      version,
      approvedByUserId: outcome.approvedByUserId,
      byStanding: outcome.byStanding,
      approvedAmountCents: outcome.approvedAmountCents,
      record: { lineId, amountCents, lineVersion: line.version, ...outcome.record },
    });
  }

  const after = lines.map((line) => working.get(line.id) ?? line);
  const pricing = priceEstimate(after, args.shop, args.account, amounts);
  return { ok: true, changes, lines: after, pricing, totals: pricing.totals };
}
