import { formatCents } from "@/lib/money";
import { renderMail, type RenderedMail } from "../layout";

/** E-mails of the estimate and its decisions. Pure: every fact is passed in. */

export function estimateReadyMail(p: {
  woLabel: string;
  unitNumber: string;
  title: string;
  lineCount: number;
  pendingCents: number;
  outOfService: boolean;
  url: string;
}): RenderedMail {
  return renderMail({
    subject: `${p.woLabel} · ${p.unitNumber}: estimate ready for your decision`,
    heading: `Estimate ready for ${p.unitNumber}`,
    paragraphs: [
      `The shop has priced the work on ${p.unitNumber} (${p.title}). ${p.lineCount} line${p.lineCount === 1 ? " is" : "s are"} waiting for your decision: approve, decline or hold each one for a later visit.`,
      ...(p.outOfService ? ["The technician marked something on this unit Out of service. Please look at it first."] : []),
    ],
    facts: [
      ["Work order", p.woLabel],
      ["Waiting on decision", formatCents(p.pendingCents)],
    ],
    action: { label: "Review the estimate", url: p.url },
  });
}

export interface DecisionEvent {
  approverName: string;
  /** e.g. "approved 1 line ($186.40)" */
  summary: string;
  /** Lines still waiting once this decision was made. */
  stillPending: number;
}

/** One message for every decision made on a work order within a short window (the writer gets one e-mail, not three). */
export function decisionsMadeMail(p: { woLabel: string; unitNumber: string; decisions: DecisionEvent[]; url: string }): RenderedMail {
  const names = [...new Set(p.decisions.map((d) => d.approverName))];
  const who = names.length === 1 ? names[0]! : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
  const stillPending = p.decisions.at(-1)?.stillPending ?? 0;
  const many = p.decisions.length > 1;
  return renderMail({
    subject: many ? `${p.woLabel} · ${p.unitNumber}: ${p.decisions.length} decisions by ${who}` : `${p.woLabel} · ${p.unitNumber}: ${who} decided`,
    heading: `${who} decided on ${p.unitNumber}`,
    paragraphs: [
      ...p.decisions.map((d) => `${d.approverName} ${d.summary}.`),
      stillPending ? `${stillPending} line${stillPending === 1 ? " is" : "s are"} still waiting on a decision.` : "Every line on the estimate has a decision.",
    ],
    action: { label: "Open the work order", url: p.url },
  });
}

export function lineReopenedMail(p: {
  woLabel: string;
  unitNumber: string;
  description: string;
  approvedCents: number;
  revisedCents: number;
  reason: string;
  url: string;
}): RenderedMail {
  return renderMail({
    subject: `${p.woLabel} · ${p.unitNumber}: a revised line needs your approval again`,
    heading: `A line on ${p.unitNumber} needs your approval again`,
    paragraphs: [
      `The shop revised “${p.description}” from ${formatCents(p.approvedCents)} to ${formatCents(p.revisedCents)}.`,
      `That is more than your account's overrun allowance: ${p.reason}. Your earlier approval no longer covers it, so the work waits for your decision.`,
    ],
    action: { label: "Decide on the revised line", url: p.url },
  });
}

export function timeBoxReachedMail(p: {
  woLabel: string;
  unitNumber: string;
  description: string;
  approvedHours: string;
  url: string;
  forFleet: boolean;
}): RenderedMail {
  return renderMail({
    subject: `${p.woLabel} · ${p.unitNumber}: diagnosis time used up`,
    heading: `Diagnosis time on ${p.unitNumber} is used up`,
    paragraphs: [
      `The ${p.approvedHours} approved for “${p.description}” have been used. The technician has stopped the clock on diagnosis.`,
      p.forFleet
        ? "If you want the shop to keep looking, approve an extension when the shop sends one."
        : "Send the customer an extension line if more diagnosis is needed.",
    ],
    action: { label: p.forFleet ? "See the work order" : "Open the work order", url: p.url },
  });
}
