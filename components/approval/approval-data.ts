import type { LineView, WorkOrderView } from "@/db/queries/work-order-view";

/** What the approval page's client part shows of a line (the API view carries more). */
export type ApprovalLineData = Pick<
  LineView,
  | "id"
  | "kind"
  | "description"
  | "quantity"
  | "unitPriceCents"
  | "amountCents"
  | "coreTotalCents"
  | "coreReturnedAt"
  | "state"
  | "version"
  | "findingId"
  | "concernId"
  | "reopenReason"
  | "extendsLineId"
  | "decision"
>;

type FindingView = WorkOrderView["findings"][number];

/**
 * The part of the work-order view the approval page keeps live: lines, limits,
 * totals and decisions. The whole API view (what the page polls) has this shape
 * and more; the findings' notes, readings and the timeline are rendered on the
 * server and are not sent to the browser a second time.
 */
export interface ApprovalData {
  id: string;
  status: WorkOrderView["status"];
  lines: ApprovalLineData[];
  concerns: Pick<WorkOrderView["concerns"][number], "id" | "complaint" | "cause">[];
  findings: Pick<FindingView, "id" | "title" | "severity" | "concernId" | "photos">[];
  limits: WorkOrderView["limits"];
  totals: WorkOrderView["totals"];
  estimateTotals: WorkOrderView["estimateTotals"];
  decisionLog: WorkOrderView["decisionLog"];
  /** Only in the polled view: tells the page when the server-rendered parts are out of date. */
  timeline?: { id: string }[];
}

export function approvalData(view: WorkOrderView): ApprovalData {
  return {
    id: view.id,
    status: view.status,
    lines: view.lines.map((l) => ({
      id: l.id,
      kind: l.kind,
      description: l.description,
      quantity: l.quantity,
      unitPriceCents: l.unitPriceCents,
      amountCents: l.amountCents,
      coreTotalCents: l.coreTotalCents,
      coreReturnedAt: l.coreReturnedAt,
      state: l.state,
      version: l.version,
      findingId: l.findingId,
      concernId: l.concernId,
      reopenReason: l.reopenReason,
      extendsLineId: l.extendsLineId,
      decision: l.decision,
    })),
    concerns: view.concerns.map((c) => ({ id: c.id, complaint: c.complaint, cause: c.cause })),
    findings: view.findings.map((f) => ({ id: f.id, title: f.title, severity: f.severity, concernId: f.concernId, photos: f.photos })),
    limits: view.limits,
    totals: view.totals,
    estimateTotals: view.estimateTotals,
    decisionLog: view.decisionLog,
  };
}

/**
 * Which findings and updates the server rendered: the page compares it with the
 * polled view's and asks for the server parts again when they differ. "" when
 * the data has no timeline (the page's own first data, before any poll).
 */
export function serverPartsKey(view: { findings: { id: string }[]; timeline?: { id: string }[] }): string {
  if (!view.timeline) return "";
  return `${view.findings.map((f) => f.id).join(",")}|${view.timeline.map((t) => t.id).join(",")}`;
}
