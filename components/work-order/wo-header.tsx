import Link from "next/link";
import { StatusPill } from "@/components/ui/status-pill";
import { workOrderLabel, type WorkOrderStatus } from "@/lib/domain";
import { formatDateTime, technicianLabel } from "@/lib/format";

export interface WorkOrderHeaderData {
  number: number;
  title: string;
  status: WorkOrderStatus;
  unitId: string;
  unitNumber: string;
  unitDescription: string;
  accountName: string;
  technicianName: string | null;
  clockedTechName?: string | null;
  promisedAt: string | null;
  poNumber: string | null;
}

export function WorkOrderHeader({ wo, unitHref, children }: { wo: WorkOrderHeaderData; unitHref: string; children?: React.ReactNode }) {
  return (
    <header className="mb-5 border-b-2 border-ink pb-3">
      <p className="text-sm font-semibold tracking-wide text-ink-faint uppercase">
        {workOrderLabel(wo.number)} · {wo.accountName}
      </p>
      <h1 className="text-2xl leading-tight font-bold sm:text-3xl">
        <Link href={unitHref} className="no-underline hover:underline">
          {wo.unitNumber}
        </Link>{" "}
        · {wo.title}
      </h1>
      <p className="text-ink-soft">{wo.unitDescription}</p>
      <div className="mt-2 flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
        <StatusPill status={wo.status} />
        <span>
          <span className="text-ink-faint">Tech</span> {technicianLabel(wo.technicianName, wo.clockedTechName)}
        </span>
        <span>
          <span className="text-ink-faint">Promised</span> {wo.promisedAt ? formatDateTime(wo.promisedAt) : "—"}
        </span>
        {wo.poNumber ? (
          <span>
            <span className="text-ink-faint">PO</span> {wo.poNumber}
          </span>
        ) : null}
        {children}
      </div>
    </header>
  );
}
