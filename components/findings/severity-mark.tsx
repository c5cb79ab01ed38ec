import { SEVERITY_LABELS, type Severity } from "@/lib/domain";

/**
 * Severity is a word plus a shape, never colour alone: octagon Out of service,
 * triangle Fix now, circle Plan for, square Note. Only Out of service carries
 * the accent, filled, so it stands out first.
 */
export function SeverityShape({ severity, size = 18 }: { severity: Severity; size?: number }) {
  const common = { strokeWidth: 2.5, strokeLinejoin: "round" as const };
  return (
    <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden className="shrink-0" data-shape={SHAPES[severity]}>
      {severity === "out_of_service" ? (
        <polygon points="8,2 16,2 22,8 22,16 16,22 8,22 2,16 2,8" fill="#b4501e" stroke="#8c3b12" {...common} />
      ) : severity === "fix_now" ? (
        <polygon points="12,2.5 22,21 2,21" fill="#2a2a28" stroke="#2a2a28" {...common} />
      ) : severity === "plan" ? (
        <circle cx="12" cy="12" r="9.5" fill="none" stroke="#2a2a28" {...common} />
      ) : (
        <rect x="3.5" y="3.5" width="17" height="17" fill="none" stroke="#6e685e" {...common} />
      )}
    </svg>
  );
}

const SHAPES: Record<Severity, string> = { out_of_service: "octagon", fix_now: "triangle", plan: "circle", note: "square" };

export function SeverityMark({ severity, size = "md" }: { severity: Severity; size?: "sm" | "md" }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 font-bold ${size === "sm" ? "text-xs" : "text-sm"} ${
        severity === "out_of_service" ? "text-rust-deep" : "text-ink"
      }`}
      data-severity={severity}
    >
      <SeverityShape severity={severity} size={size === "sm" ? 14 : 18} />
      {SEVERITY_LABELS[severity]}
    </span>
  );
}
