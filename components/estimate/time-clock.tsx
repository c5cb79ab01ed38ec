"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useNow } from "@/components/data/use-now";
import { Button } from "@/components/ui/button";
import { lineProgressAction } from "@/lib/actions/estimate";
import { clockInAction, clockOutAction } from "@/lib/actions/time-clock";
import type { LineState } from "@/lib/domain";
import { formatHours, isApprovedState, milliHoursFromSeconds, timeBox } from "@/lib/estimate";

export interface ClockLine {
  id: string;
  description: string;
  kind: string;
  state: LineState;
  isDiagnosis: boolean;
  approvedMilli: number;
  usedMilli: number;
  mySince: string | null;
}

function elapsedMilli(since: string, now: number): number {
  return milliHoursFromSeconds(Math.max(0, Math.floor((now - Date.parse(since)) / 1000)));
}

/** A diagnosis line's box: used against approved hours, with the 80 % warning and the 100 % stop in words. */
function TimeBoxBar({ usedMilli, approvedMilli }: { usedMilli: number; approvedMilli: number }) {
  const box = timeBox(usedMilli, approvedMilli);
  const width = Math.min(100, box.percent);
  return (
    <div className="mt-2" data-testid="time-box" data-status={box.status}>
      <div className="flex justify-between text-sm">
        <span>
          Diagnosis time box: <strong className="figures">{formatHours(usedMilli)}</strong> of {formatHours(approvedMilli)} approved
        </span>
        <span className="figures font-semibold">{box.percent}%</span>
      </div>
      <div className="mt-1 h-3 overflow-hidden rounded-full border border-ink bg-paper" aria-hidden>
        <div className={`h-full ${box.status === "ok" ? "bg-ink-soft" : "bg-rust"}`} style={{ width: `${width}%` }} />
      </div>
      {box.status === "warn" ? <p className="mt-1 text-sm font-semibold text-rust-deep">Over 80 % of the approved diagnosis time is used. Tell the writer if you need more.</p> : null}
      {box.status === "blocked" ? (
        <p className="mt-1 text-sm font-semibold text-rust-deep">The approved diagnosis time is used up. Clocking in waits until the customer approves an extension.</p>
      ) : null}
    </div>
  );
}

/** The technician's clock on approved labour, and marking work started or done. */
export function TimeClock({ workOrderId, lines }: { workOrderId: string; lines: ClockLine[] }) {
  const router = useRouter();
  const now = useNow(1000);
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const run = (fn: () => Promise<{ ok: boolean; error?: string }>) =>
    start(async () => {
      const r = await fn();
      setError(r.ok ? null : (r.error ?? "That did not work."));
      router.refresh();
    });
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
        const running = l.mySince ? elapsedMilli(l.mySince, now) : 0;
        return (
          <div key={l.id} className="rounded-card border border-rule bg-paper p-3" data-testid="clock-line">
            <p className="font-semibold">{l.description}</p>
            {l.kind === "labor" ? (
              <p className="figures text-sm text-ink-soft">
                Clocked {formatHours(l.usedMilli)}
                {l.mySince ? ` · running now ${formatHours(running)}` : ""}
              </p>
            ) : null}
            {l.isDiagnosis ? <TimeBoxBar usedMilli={l.usedMilli} approvedMilli={l.approvedMilli} /> : null}
            <div className="mt-2 flex flex-wrap gap-2">
              {l.kind === "labor" && l.state !== "done" ? (
                l.mySince ? (
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
