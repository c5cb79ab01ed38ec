import { renderMail, type RenderedMail } from "@/lib/mail/layout";

export interface UnitReadyFacts {
  shopName: string;
  unitNumber: string;
  unitDescription: string;
  workOrderLabel: string;
  note: string;
  url: string;
}

/** "Ready for pickup", to the account's approvers and viewers, linking to the unit's page. Pure. */
export function unitReadyMail(f: UnitReadyFacts): RenderedMail {
  return renderMail({
    subject: `${f.unitNumber} is ready for pickup (${f.workOrderLabel})`,
    heading: `${f.unitNumber} is ready for pickup`,
    paragraphs: [
      `${f.shopName} has finished the work on ${f.unitNumber} (${f.unitDescription}).`,
      ...(f.note ? [`The shop's note: “${f.note}”`] : []),
      "The unit's page shows what was found and done on this visit.",
    ],
    facts: [
      ["Unit", f.unitNumber],
      ["Work order", f.workOrderLabel],
    ],
    action: { label: `See ${f.unitNumber}`, url: f.url },
  });
}
