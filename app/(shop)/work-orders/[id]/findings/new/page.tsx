import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { FindingForm } from "@/components/findings/form/finding-form";
import { EmptyState } from "@/components/ui/empty-state";
import { findWorkOrder, loadConcerns } from "@/db/queries/work-order-detail";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { workOrderLabel } from "@/lib/domain";

export const metadata: Metadata = { title: "Add a finding" };

export default async function NewFindingPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageRole(CAN.postFindings);
  const { id } = await params;
  const wo = await findWorkOrder(user, id);
  if (!wo) notFound();
  const concerns = await loadConcerns(wo.id);
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <header className="border-b-2 border-ink pb-3">
        <Link href={`/work-orders/${wo.id}`} className="inline-flex min-h-touch items-center text-sm font-semibold">
          ‹ Back to {workOrderLabel(wo.number)}
        </Link>
        <p className="text-sm font-semibold tracking-wide text-ink-faint uppercase">
          {wo.unitNumber} · {workOrderLabel(wo.number)} · {wo.accountName}
        </p>
        <h1 className="text-2xl font-bold">Add a finding</h1>
      </header>
      {wo.status === "released" ? (
        <EmptyState title="This visit is closed.">Findings can be added only while the unit is in the shop.</EmptyState>
      ) : (
        <FindingForm workOrderId={wo.id} concerns={concerns.map((c) => ({ id: c.id, complaint: c.complaint }))} />
      )}
    </div>
  );
}
