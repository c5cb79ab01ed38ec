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

/** The diagnosis time box at 80 % (warn) or full (reached: the clock stopped by itself). */
export function timeBoxMail(p: {
  kind: "warn" | "reached";
  woLabel: string;
  unitNumber: string;
  description: string;
  /** "1 h 36 min" */
  used: string;
  /** "2.0 h" */
  approved: string;
  url: string;
  reader: "tech" | "writer" | "fleet";
}): RenderedMail {
  const reached = p.kind === "reached";
  const next = {
    tech: reached ? "Clocking in on it waits until the customer approves more time; tell the writer what you still need to check." : "Tell the writer now if you need more time, so it can be asked for before the clock stops.",
    writer: reached ? "Ask the customer for more hours from the work order if more diagnosis is needed." : "If more time is needed, ask the customer for it from the work order before the clock stops.",
    fleet: "If the shop needs more time to find the fault, you will be asked to approve it.",
  }[p.reader];
  return renderMail({
    subject: `${p.woLabel} · ${p.unitNumber}: ${reached ? "diagnosis time used up, the clock stopped" : "80 % of the diagnosis time used"}`,
    heading: reached ? `Diagnosis time on ${p.unitNumber} is used up` : `Diagnosis time on ${p.unitNumber} is 80 % used`,
    paragraphs: [
      reached
        ? `All ${p.approved} approved for “${p.description}” have been clocked (${p.used}). The clock stopped by itself at the time box; every minute clocked is kept.`
        : `${p.used} of the ${p.approved} approved for “${p.description}” have been clocked. The clock stops by itself when the time box is full.`,
      next,
    ],
    action: { label: p.reader === "fleet" ? "See the work order" : "Open the work order", url: p.url },
  });
}

/** The shop asks the customer for more diagnosis hours: a new line waiting on their decision. */
export function timeBoxExtensionMail(p: {
  woLabel: string;
  unitNumber: string;
  description: string;
  more: string;
  used: string;
  approved: string;
  amountCents: number;
  note: string;
  url: string;
}): RenderedMail {
  return renderMail({
    subject: `${p.woLabel} · ${p.unitNumber}: the shop asks for ${p.more} more diagnosis time`,
    heading: `More diagnosis time asked for on ${p.unitNumber}`,
    paragraphs: [
      `The technician has clocked ${p.used} of the ${p.approved} you approved for “${p.description}”. The shop asks for ${p.more} more (${formatCents(p.amountCents)}).`,
      ...(p.note ? [`The shop says: ${p.note}`] : []),
      "Approve, decline or hold the extension like any other line. Until it is approved the technician's clock stays stopped.",
    ],
    action: { label: "Decide on the extension", url: p.url },
  });
}

/** An approver passes lines past their own signing limit to a colleague who can sign for them. */
export function passedOnMail(p: {
  woLabel: string;
  unitNumber: string;
  from: string;
  note: string;
  lines: { description: string; amountCents: number; url: string }[];
  url: string;
}): RenderedMail {
  const total = p.lines.reduce((s, l) => s + l.amountCents, 0);
  return renderMail({
    subject: `${p.woLabel} · ${p.unitNumber}: ${p.from} passed ${p.lines.length} line${p.lines.length === 1 ? "" : "s"} to you to decide`,
    heading: `${p.from} asks you to decide on ${p.unitNumber}`,
    paragraphs: [
      `These ${p.lines.length === 1 ? "line is" : "lines are"} past ${p.from}'s signing limit (${formatCents(total)} in all):`,
      ...p.lines.map((l) => `• ${l.description}: ${formatCents(l.amountCents)} — ${l.url}`),
      ...(p.note ? [`${p.from} says: ${p.note}`] : []),
    ],
    action: { label: "Decide on these lines", url: p.url },
  });
}
