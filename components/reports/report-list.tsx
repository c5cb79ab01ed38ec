import Link from "next/link";
import { SeverityMark } from "@/components/findings/severity-mark";
import { EmptyState } from "@/components/ui/empty-state";
import type { ServiceRequestItem } from "@/db/queries/service-requests";
import { SERVICE_REQUEST_STATUS_LABELS } from "@/lib/domain";
import { formatDateTime, formatNumber } from "@/lib/format";

/** Defect reports with where each stands: waiting for the shop, checked in on a visit, fixed. */
export function ReportList({ rows, shop, empty }: { rows: ServiceRequestItem[]; shop: boolean; empty: string }) {
  if (!rows.length) return <EmptyState title={empty} />;
  return (
    <ul className="flex flex-col gap-3" data-testid="report-list">
      {rows.map((r) => (
        <li key={r.id} className="rounded-card border border-rule bg-paper-card p-3" data-testid="report" data-status={r.status}>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <p className="text-lg font-bold">
              {r.unitNumber}
              {shop ? <span className="ml-2 text-sm font-normal text-ink-soft">{r.accountName}</span> : null}
            </p>
            <p className="text-sm font-semibold" data-testid="report-status">
              {r.status === "scheduled" && r.workOrderLabel ? `Checked in at the shop on ${r.workOrderLabel}` : SERVICE_REQUEST_STATUS_LABELS[r.status]}
            </p>
          </div>
          {r.outOfService ? (
            <p className="mt-1">
              <SeverityMark severity="out_of_service" size="sm" />
            </p>
          ) : null}
          <ul className="mt-1 list-disc pl-5">
            {r.defects.map((d, i) => (
              <li key={i}>
                {d.area ? <span className="font-semibold">{d.area}: </span> : null}
                {d.description}
                {d.outOfService ? " (out of service)" : ""}
              </li>
            ))}
          </ul>
          {r.note ? <p className="mt-1 text-sm">“{r.note}”</p> : null}
          <p className="mt-1 text-xs text-ink-faint">
            Reported by {r.reporterName}, {formatDateTime(r.createdAt)}
            {r.odometer !== null ? ` · ${formatNumber(r.odometer)} mi` : ""}
            {r.photos.length ? ` · ${r.photos.length} photo` : ""}
          </p>
          {shop && r.status === "open" ? (
            <p className="mt-2">
              <Link href={`/work-orders/new?serviceRequestId=${r.id}`} className="font-bold">
                Check {r.unitNumber} in from this report
              </Link>
            </p>
          ) : null}
          {!shop && r.workOrderId ? (
            <p className="mt-2">
              <Link href={`/fleet/work-orders/${r.workOrderId}`}>See the visit</Link>
            </p>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
