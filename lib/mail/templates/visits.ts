import { renderMail, type RenderedMail } from "../layout";

/** E-mails about a unit arriving at the shop and the fleet's defect reports. Pure: every fact is passed in. */

const sentFor = (shopName: string) => `Sent by Cotter for ${shopName}.`;

export function checkedInMail(p: {
  shopName: string;
  unitNumber: string;
  unitDescription: string;
  woLabel: string;
  complaints: string[];
  promisedBy: string | null;
  technician: string | null;
  url: string;
}): RenderedMail {
  return renderMail({
    subject: `${p.unitNumber} checked in at ${p.shopName} (${p.woLabel})`,
    heading: `${p.unitNumber} is checked in`,
    paragraphs: [
      `${p.shopName} has checked in ${p.unitNumber} (${p.unitDescription}) on ${p.woLabel}.`,
      `What it came in for: ${p.complaints.map((c) => `“${c}”`).join("; ")}.`,
      "You can follow the visit live; an estimate comes to you for a decision before any work past your standing authorisation.",
    ],
    facts: [
      ["Work order", p.woLabel],
      ["Promised by", p.promisedBy ?? "not set yet"],
      ["Technician", p.technician ?? "not assigned yet"],
    ],
    action: { label: `Follow ${p.unitNumber}`, url: p.url },
    footer: sentFor(p.shopName),
  });
}

export function defectReportedMail(p: {
  shopName: string;
  accountName: string;
  unitNumber: string;
  reporterName: string;
  defects: { description: string; outOfService: boolean }[];
  url: string;
}): RenderedMail {
  const oos = p.defects.some((d) => d.outOfService);
  return renderMail({
    subject: `${oos ? "Out of service: " : ""}defect report on ${p.unitNumber} (${p.accountName})`,
    heading: `${p.reporterName} reported ${p.defects.length === 1 ? "a defect" : `${p.defects.length} defects`} on ${p.unitNumber}`,
    paragraphs: [
      ...p.defects.map((d) => `${d.outOfService ? "Out of service: " : ""}${d.description}`),
      "Check the unit in from the report and its defects become the visit's concerns.",
    ],
    facts: [
      ["Account", p.accountName],
      ["Unit", p.unitNumber],
    ],
    action: { label: "See the report", url: p.url },
    footer: sentFor(p.shopName),
  });
}

export function defectProgressMail(p: { shopName: string; unitNumber: string; woLabel: string; stage: "scheduled" | "fixed"; url: string }): RenderedMail {
  const scheduled = p.stage === "scheduled";
  return renderMail({
    subject: scheduled ? `Your defect report on ${p.unitNumber} is checked in (${p.woLabel})` : `The defects you reported on ${p.unitNumber} are fixed`,
    heading: scheduled ? `${p.unitNumber} is in the shop` : `${p.unitNumber} is fixed`,
    paragraphs: [
      scheduled
        ? `${p.shopName} checked ${p.unitNumber} in on ${p.woLabel}; what you reported is on the visit as its concerns.`
        : `${p.shopName} has finished ${p.woLabel} on ${p.unitNumber}, the visit your report went onto.`,
    ],
    action: { label: "See your report", url: p.url },
    footer: sentFor(p.shopName),
  });
}
