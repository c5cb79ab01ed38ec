"use client";

import { useRouter } from "next/navigation";
import { useEffect, useRef, useState, useTransition } from "react";
import { useNow } from "@/components/data/use-now";
import { Button } from "@/components/ui/button";
import { lineProgressAction } from "@/lib/server/actions/estimate";
import { clockInAction, clockOutAction } from "@/lib/server/actions/time-clock";
import type { LineState } from "@/lib/domain";
import { diagnosisClock, formatClock, formatTenths, isApprovedState, workedMs, type ClockSpan } from "@/lib/estimate";
import { formatDateTime } from "@/lib/format";
import { AskForMoreTime } from "./ask-for-more-time";

export interface ClockLine {
  id: string;
  description: string;
  kind: string;
  state: LineState;
  isDiagnosis: boolean;
  /** The box: the line's approved hours and its approved extensions. */
  approvedMilli: number;
  /** Extension hours asked of the customer, not yet decided. */
  pendingMilli: number;
  spans: (ClockSpan & { techId: string })[];
}

/** A diagnosis line's box: clocked against approved hours, with the 80 % warning and the stop at 100 % in words. */
function TimeBoxBar({ line, now, canAsk, workOrderId }: { line: ClockLine; now: number; canAsk: boolean; workOrderId: string }) {
  const clock = diagnosisClock({ spans: line.spans, approvedMilli: line.approvedMilli, atMs: now });
  const { box } = clock;
  const width = Math.min(100, box.percent);
  return (
    <div className="mt-2" data-testid="time-box" data-status={box.status}>
      <div className="flex justify-between gap-2 text-sm">
        <span>
          Diagnosis time box: <strong className="figures">{formatClock(clock.usedMs)}</strong> of {formatTenths(line.approvedMilli)} approved
        </span>
        <span className="figures font-semibold">{box.percent}%</span>
      </div>
      <div className="mt-1 h-3 overflow-hidden rounded-full border border-ink bg-paper" aria-hidden>
        <div className={`h-full ${box.status === "ok" ? "bg-ink-soft" : "bg-rust"}`} style={{ width: `${width}%` }} />
      </div>
      {box.status === "warn" ? (
        <p role="status" className="mt-1 text-sm font-semibold text-rust-deep" data-testid="time-box-warning">
          Over 80 % of the approved diagnosis time is used. The clock stops by itself at {formatTenths(line.approvedMilli)}
          {clock.stopAtMs !== null ? ` (about ${formatDateTime(new Date(clock.stopAtMs).toISOString())})` : ""}; tell the writer now if you need more.
        </p>
      ) : null}
      {box.status === "blocked" ? (
        <p role="status" className="mt-1 text-sm font-semibold text-rust-deep" data-testid="time-box-stopped">
          The approved diagnosis time is used up: the clock stopped by itself at the time box. Every minute clocked is kept; clocking in waits until the
          customer approves more time.
        </p>
      ) : null}
      {clock.pastMs > 0 ? (
        <p className="mt-1 text-sm font-semibold" data-testid="time-box-past">
          {formatClock(clock.pastMs)} past the time box, not billable until the customer extends it.
        </p>
      ) : null}
      {line.pendingMilli > 0 ? (
        <p className="mt-1 text-sm" data-testid="time-box-pending">
          {formatTenths(line.pendingMilli)} more asked of the customer; waiting on their decision.
        </p>
      ) : canAsk && box.status !== "ok" ? (
        <AskForMoreTime lineId={line.id} workOrderId={workOrderId} />
      ) : null}
    </div>
  );
}

/** The clock on approved labour (hours and minutes), and marking work started or done. */
export function TimeClock({
  workOrderId,
  lines,
  userId,
  renderedAt,
  canAskForMore,
}: {
  workOrderId: string;
  lines: ClockLine[];
  userId: string;
  renderedAt: number;
  canAskForMore: boolean;
}) {
  const router = useRouter();
  const ticked = useNow(1000, renderedAt);
  // Never before a clock the server just started (the next tick may be up to a second away).
  const now = Math.max(ticked, ...lines.flatMap((l) => l.spans.map((s) => s.startMs)));
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const run = (fn: () => Promise<{ ok: boolean; error?: string }>) =>
    start(async () => {
      const r = await fn();
      setError(r.ok ? null : (r.error ?? "That did not work."));
      router.refresh();
    });
  const mine = (l: ClockLine) => l.spans.find((s) => s.techId === userId && s.endMs === null) ?? null;
  // A clock that stopped by itself while the page was open: fetch the truth once.
  const stopped = lines.some((l) => {
    const s = mine(l);
    return s?.stopAtMs != null && s.stopAtMs <= now;
  });
  const refreshed = useRef(false);
  useEffect(() => {
    if (stopped && !refreshed.current) {
      refreshed.current = true;
      router.refresh();
    }
    if (!stopped) refreshed.current = false;
  }, [stopped, router]);

  const workable = lines.filter((l) => isApprovedState(l.state));
  if (!workable.length) return <p className="text-sm text-ink-faint">No approved work to clock yet.</p>;
  return (
    <div className="flex flex-col gap-3" data-testid="time-clock">
      {error ? (
        <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
          {error}
        </p>
      ) : null}
      {workable.map((l) => {
        const my = mine(l);
        const running = my !== null && (my.stopAtMs == null || my.stopAtMs > now);
        return (
          <div key={l.id} className="rounded-card border border-rule bg-paper p-3" data-testid="clock-line">
            <p className="font-semibold">{l.description}</p>
            {l.kind === "labor" ? (
              <p className="figures text-sm text-ink-soft" data-testid="clocked">
                Clocked {formatClock(workedMs(l.spans, now))}
                {my ? ` · ${running ? "running now" : "stopped at the time box after"} ${formatClock(workedMs([my], now))}` : ""}
              </p>
            ) : null}
            {l.isDiagnosis ? <TimeBoxBar line={l} now={now} canAsk={canAskForMore} workOrderId={workOrderId} /> : null}
            <div className="mt-2 flex flex-wrap gap-2">
              {l.kind === "labor" && l.state !== "done" ? (
                running ? (
                  <Button type="button" disabled={pending} onClick={() => run(() => clockOutAction({ lineId: l.id, workOrderId }))}>
                    Clock out
                  </Button>
                ) : (
                  <Button type="button" variant="secondary" disabled={pending} onClick={() => run(() => clockInAction({ lineId: l.id, workOrderId }))}>
                    Clock in
                  </Button>
                )
              ) : null}
              {l.state !== "done" ? (
                <Button type="button" variant="quiet" disabled={pending} onClick={() => run(() => lineProgressAction({ lineId: l.id, workOrderId, state: "done" }))}>
                  Mark done
                </Button>
              ) : (
                <span className="self-center text-sm font-semibold">Done ✓</span>
              )}
            </div>
          </div>
        );
      })}
    </div>
  );
}
