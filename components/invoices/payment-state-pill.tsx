import { PAYMENT_STATE_LABELS, type PaymentState } from "@/lib/invoices/balance";

/**
 * An invoice's state as a word plus a shape (an empty ring, a half-filled
 * ring, a full disc, a struck ring), never colour alone. Open balances carry
 * the accent because someone has to act on them.
 */
export function PaymentStatePill({ state, size = "md" }: { state: PaymentState; size?: "sm" | "md" }) {
  const owes = state === "open" || state === "partly_paid";
  return (
    <span
      data-state={state}
      className={`inline-flex items-center gap-1.5 rounded-full border-2 px-2.5 py-0.5 font-semibold whitespace-nowrap ${
        owes ? "border-rust bg-rust-wash text-rust-deep" : state === "void" ? "border-rule-strong bg-paper-card text-ink-faint" : "border-ink bg-paper-card text-ink"
      } ${size === "sm" ? "text-xs" : "text-sm"}`}
    >
      <StateShape state={state} />
      {PAYMENT_STATE_LABELS[state]}
    </span>
  );
}

function StateShape({ state }: { state: PaymentState }) {
  return (
    <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden className="shrink-0">
      <circle cx="6" cy="6" r="4.5" fill={state === "paid" ? "currentColor" : "none"} stroke="currentColor" strokeWidth="1.8" />
      {state === "partly_paid" ? <path d="M6 1.5 A4.5 4.5 0 0 1 6 10.5 Z" fill="currentColor" /> : null}
      {state === "void" ? <path d="M2.5 9.5 L9.5 2.5" stroke="currentColor" strokeWidth="1.8" /> : null}
    </svg>
  );
}
