"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/components/data/fetcher";
import { STATUS_LABELS, WORK_ORDER_STATUSES, type WorkOrderStatus } from "@/lib/domain";

/** Moves the visit to a status with a note for the customer; each post is a dated timeline entry. */
export function StatusMover({
  workOrderId,
  status,
  unitNumber,
  waitingLines = 0,
  canSettle = false,
}: {
  workOrderId: string;
  status: WorkOrderStatus;
  unitNumber: string;
  /** Lines still waiting for the customer's decision: releasing must say what becomes of them. */
  waitingLines?: number;
  /** The owner and writers may hold or decline them; a technician is told to ask. */
  canSettle?: boolean;
}) {
  const router = useRouter();
  const [next, setNext] = useState<WorkOrderStatus>(status);
  const [note, setNote] = useState("");
  const [pendingLines, setPendingLines] = useState<"hold" | "decline" | null>(null);
  const [pendingNote, setPendingNote] = useState("");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const [busy, setBusy] = useState(false);

  if (status === "released") return <p className="text-ink-soft">This visit is closed: {unitNumber} was released.</p>;

  const releasing = next === "released";
  const unchanged = next === status && note.trim() === "";
  const mustSettle = releasing && waitingLines > 0;
  const unsettled = mustSettle && (!canSettle || pendingLines === null || (pendingLines === "decline" && pendingNote.trim() === ""));

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setMessage(null);
    try {
      await fetchJson(`/api/v1/work-orders/${workOrderId}/status`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ status: next, note, ...(mustSettle && pendingLines ? { pendingLines, pendingNote } : {}) }),
      });
      setNote("");
      setMessage({ ok: true, text: `Posted: ${STATUS_LABELS[next]}. The customer sees it within seconds.` });
      startTransition(() => router.refresh());
    } catch (error) {
      setMessage({ ok: false, text: error instanceof ApiError ? error.message : "Could not post the update. Try again." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" data-testid="status-mover">
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Status</span>
        <select className={inputClass} value={next} onChange={(e) => setNext(e.target.value as WorkOrderStatus)} name="status">
          {WORK_ORDER_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_LABELS[s]}
              {s === status ? " (now)" : ""}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Note for the customer (optional)</span>
        <textarea
          name="note"
          className={`${inputClass} min-h-20 py-2`}
          maxLength={500}
          value={note}
          onChange={(e) => setNote(e.target.value)}
          placeholder="e.g. Parts arrive Thursday morning."
        />
      </label>
      {releasing ? (
        <p className="rounded-card border-2 border-ink px-3 py-2 text-sm font-semibold">
          Releasing closes this visit for good: it can no longer be moved, and new work needs a new work order.
        </p>
      ) : null}
      {mustSettle ? (
        <fieldset className="flex flex-col gap-2 rounded-card border-2 border-rust px-3 py-2" data-testid="settle-waiting-lines">
          <legend className="px-1 font-semibold">
            {waitingLines} line{waitingLines === 1 ? "" : "s"} still wait{waitingLines === 1 ? "s" : ""} for the customer&apos;s decision
          </legend>
          {canSettle ? (
            <>
              <label className="flex min-h-touch items-center gap-2">
                <input type="radio" name="pendingLines" className="size-5 accent-rust" checked={pendingLines === "hold"} onChange={() => setPendingLines("hold")} />
                Hold {waitingLines === 1 ? "it" : "them"} for {unitNumber}&apos;s next visit
              </label>
              <label className="flex min-h-touch items-center gap-2">
                <input type="radio" name="pendingLines" className="size-5 accent-rust" checked={pendingLines === "decline"} onChange={() => setPendingLines("decline")} />
                Decline {waitingLines === 1 ? "it" : "them"}, with a note
              </label>
              {pendingLines ? (
                <label className="flex flex-col gap-1">
                  <span className="text-sm font-semibold">{pendingLines === "decline" ? "Why (the customer reads this)" : "Note (optional)"}</span>
                  <input className={inputClass} name="pendingNote" maxLength={500} value={pendingNote} onChange={(e) => setPendingNote(e.target.value)} />
                </label>
              ) : null}
            </>
          ) : (
            <p className="text-sm">The owner or a service writer decides what becomes of them, and releases this visit.</p>
          )}
        </fieldset>
      ) : null}
      {next === "ready" && status !== "ready" ? (
        <p className="text-sm text-ink-soft">The account&apos;s approvers and viewers get an e-mail that {unitNumber} is ready.</p>
      ) : null}
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`text-sm font-semibold ${message.ok ? "" : "text-rust-deep"}`}>
          {message.text}
        </p>
      ) : null}
      <Button type="submit" variant={releasing ? "danger" : "secondary"} disabled={busy || pending || unchanged || unsettled} className="w-full sm:w-auto">
        {busy ? "Posting…" : releasing ? `Release ${unitNumber}` : next === status ? "Post update" : `Move to ${STATUS_LABELS[next]}`}
      </Button>
    </form>
  );
}
