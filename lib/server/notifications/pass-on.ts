import "server-only";
import type { Tx } from "@/db/client";
import { workOrderForMail } from "@/db/queries/work-order-detail";
import { workOrderLabel } from "@/lib/domain";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { passedOnMail } from "@/lib/mail/templates/estimate";

/** The one e-mail to a colleague who was passed lines to decide: each line with its own link. */
export async function queuePassedOn(
  tx: Tx,
  p: { workOrderId: string; from: string; to: { email: string }; lines: { id: string; description: string; amountCents: number }[]; note: string },
): Promise<void> {
  const wo = await workOrderForMail(p.workOrderId, tx);
  const page = `/fleet/work-orders/${wo.id}`;
  const mail = passedOnMail({
    woLabel: workOrderLabel(wo.number),
    unitNumber: wo.unitNumber,
    from: p.from,
    note: p.note,
    lines: p.lines.map((l) => ({ ...l, url: appUrl(`${page}#line-${l.id}`) })),
    url: appUrl(`${page}#line-${p.lines[0]?.id ?? ""}`),
  });
  await queueMail(tx, { to: [p.to.email], template: "lines_passed_on", mail });
}
