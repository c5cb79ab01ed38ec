import Link from "next/link";
import { SeverityMark } from "@/components/findings/severity-mark";
import type { FloorCard } from "@/db/queries/work-order-list";
import { formatDateTime, technicianLabel } from "@/lib/format";

export function WorkOrderCard({ wo, now, href }: { wo: FloorCard; now: number; href: string }) {
  const late = wo.promisedAt !== null && Date.parse(wo.promisedAt) < now && wo.status !== "ready";
  return (
    <Link
      href={href}
      className="block rounded-card border border-rule bg-paper-card p-3 no-underline shadow-[0_1px_0_#d8cdb9] hover:border-ink"
      data-testid="floor-card"
    >
      <div className="flex items-baseline justify-between gap-2">
        <span className="text-lg font-bold">{wo.unitNumber}</span>
        <span className="figures text-sm text-ink-faint">{wo.label}</span>
      </div>
      <p className="text-sm text-ink-soft">{wo.accountName}</p>
      {wo.outOfService ? (
        <p className="mt-1">
          <SeverityMark severity="out_of_service" size="sm" />
        </p>
      ) : null}
      <p className="mt-1 line-clamp-2 font-semibold">{wo.title || wo.unitDescription}</p>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-2 text-sm">
        <dt className="text-ink-faint">Tech</dt>
        <dd>{technicianLabel(wo.technicianName, wo.clockedTechName)}</dd>
        <dt className="text-ink-faint">Promised</dt>
        <dd className={late ? "font-bold text-rust-deep" : ""}>
          {wo.promisedAt ? formatDateTime(wo.promisedAt) : "—"}
          {late ? " · late" : ""}
        </dd>
      </dl>
      {wo.lastNote ? <p className="mt-2 border-t border-rule pt-2 text-sm text-ink-soft">“{wo.lastNote}”</p> : null}
    </Link>
  );
}
