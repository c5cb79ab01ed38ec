import { formatCents } from "@/lib/money";

/** Money in tabular figures, so columns of amounts line up. */
export function Money({ cents, className = "" }: { cents: number; className?: string }) {
  return <span className={`figures whitespace-nowrap ${className}`}>{formatCents(cents)}</span>;
}
