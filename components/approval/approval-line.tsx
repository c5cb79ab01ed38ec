"use client";

import { useState } from "react";
import { Money } from "@/components/ui/money";
import { DecisionLine, LineStatePill } from "@/components/estimate/line-state";
import type { ApprovalLineData } from "./approval-data";
import { LINE_KIND_LABELS, type Decision } from "@/lib/domain";
import { formatQuantity } from "@/lib/format";

// The classes are in app/globals.css (.decide-*): the page repeats them on every line.
const BUTTONS: { decision: Decision; label: string; style: string }[] = [
  { decision: "approve", label: "Approve", style: "decide-approve" },
  { decision: "decline", label: "Decline", style: "decide-decline" },
  { decision: "hold", label: "Hold for later", style: "decide-hold" },
];

/** One line for the approver: what it is, what it costs, and three big buttons. */
export function ApprovalLine({
  line,
  canDecide,
  busy,
  refusal,
  onDecide,
  children,
}: {
  line: ApprovalLineData;
  canDecide: boolean;
  busy: boolean;
  refusal: string | null;
  onDecide: (decision: Decision, note: string) => void;
  children?: React.ReactNode;
}) {
  const [note, setNote] = useState("");
  const [showNote, setShowNote] = useState(false);
  const pending = line.state === "proposed";
  return (
    <li id={`line-${line.id}`} className="approval-line" data-testid="approval-line" data-line-id={line.id} data-state={line.state}>
      <div className="flex items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-xs font-semibold text-ink-faint uppercase">{LINE_KIND_LABELS[line.kind]}</p>
          <p className="font-semibold">{line.description}</p>
          <p className="figures text-sm text-ink-soft">
            {formatQuantity(line.quantity * 1000)} × <Money cents={line.unitPriceCents} />
            {line.coreTotalCents ? (
              <>
                {" "}
                · core <Money cents={line.coreTotalCents} /> {line.coreReturnedAt ? "(came back: credited)" : "(refunded when returned)"}
              </>
            ) : null}
          </p>
        </div>
        <div className="text-right">
          <p className="text-lg font-bold">
            <Money cents={line.amountCents} />
          </p>
          <LineStatePill state={line.state} />
        </div>
      </div>
      {children}
      {line.reopenReason && pending ? (
        <p className="mt-2 text-sm font-semibold text-rust-deep">
          {line.extendsLineId ? "Why the shop asks for more time" : "Back for your approval"}: {line.reopenReason}
        </p>
      ) : null}
      <DecisionLine decision={line.decision} />
      {refusal ? (
        <p role="alert" className="mt-2 rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep" data-testid="refusal">
          {refusal}
        </p>
      ) : null}
      {pending && canDecide ? (
        <>
          {showNote ? (
            <label className="mt-2 flex flex-col gap-1">
              <span className="text-sm font-semibold">Note to the shop (optional)</span>
              <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={2} maxLength={1000} className="rounded-card border-2 border-rule-strong bg-white p-2" />
            </label>
          ) : (
            <button type="button" className="mt-2 text-sm underline underline-offset-4" onClick={() => setShowNote(true)}>
              Add a note
            </button>
          )}
          <div className="mt-2 grid grid-cols-3 gap-2">
            {BUTTONS.map((b) => (
              <button
                key={b.decision}
                type="button"
                disabled={busy}
                onClick={() => onDecide(b.decision, note)}
                className={`decide ${b.style}`}
              >
                {b.label}
              </button>
            ))}
          </div>
        </>
      ) : null}
    </li>
  );
}
