"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { ApiError, fetchJson } from "@/components/data/fetcher";
import { STATUS_LABELS, WORK_ORDER_STATUSES, type WorkOrderStatus } from "@/lib/domain";

/** Moves the visit to a status with a note for the customer; each post is a dated timeline entry. */
export function StatusMover({ workOrderId, status, unitNumber }: { workOrderId: string; status: WorkOrderStatus; unitNumber: string }) {
  const router = useRouter();
  const [next, setNext] = useState<WorkOrderStatus>(status);
  const [note, setNote] = useState("");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const [busy, setBusy] = useState(false);

  if (status === "released") return <p className="text-ink-soft">This visit is closed: {unitNumber} was released.</p>;

  const releasing = next === "released";
  const unchanged = next === status && note.trim() === "";

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setMessage(null);
    try {
      await fetchJson(`/api/v1/work-orders/${workOrderId}/status`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ status: next, note }),
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
      {next === "ready" && status !== "ready" ? (
        <p className="text-sm text-ink-soft">The account&apos;s approvers and viewers get an e-mail that {unitNumber} is ready.</p>
      ) : null}
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`text-sm font-semibold ${message.ok ? "" : "text-rust-deep"}`}>
          {message.text}
        </p>
      ) : null}
      <Button type="submit" variant={releasing ? "danger" : "secondary"} disabled={busy || pending || unchanged} className="w-full sm:w-auto">
        {busy ? "Posting…" : releasing ? `Release ${unitNumber}` : next === status ? "Post update" : `Move to ${STATUS_LABELS[next]}`}
      </Button>
    </form>
  );
}
