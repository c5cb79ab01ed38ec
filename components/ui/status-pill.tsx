import { STATUS_LABELS, WORK_ORDER_STATUSES, type WorkOrderStatus } from "@/lib/domain";

/**
 * A status reads as its word plus a step gauge (how far along the visit is),
 * so it never depends on colour. Waiting on approval is the one the fleet acts
 * on, so it carries the accent.
 */
export function StatusPill({ status, size = "md" }: { status: WorkOrderStatus | null; size?: "sm" | "md" }) {
  if (!status) return <span className="text-sm text-ink-faint">Not in the shop</span>;
  const step = WORK_ORDER_STATUSES.indexOf(status);
  const needsCustomer = status === "waiting_approval";
  return (
    <span
      className={`inline-flex items-center gap-2 rounded-full border-2 px-2.5 py-0.5 font-semibold ${
        needsCustomer ? "border-rust bg-rust-wash text-rust-deep" : "border-ink bg-paper-card text-ink"
      } ${size === "sm" ? "text-xs" : "text-sm"}`}
      data-status={status}
    >
      <span aria-hidden className="flex gap-[2px]">
        {WORK_ORDER_STATUSES.map((s, i) => (
          <span key={s} className={`h-2.5 w-1 rounded-sm ${i <= step ? "bg-current" : "bg-rule"}`} />
        ))}
      </span>
      {STATUS_LABELS[status]}
    </span>
  );
}
