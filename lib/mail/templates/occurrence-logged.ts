import { formatDateTime } from "@/lib/format";
import { symptomLabel } from "@/lib/occurrences/symptoms";
import { formatTemperature } from "@/lib/occurrences/temperature";
import { formatNumber } from "@/lib/specs/exact";
import { renderMail, type RenderedMail } from "../layout";

export interface OccurrenceLoggedMail {
  unitNumber: string;
  accountName: string;
  complaint: string | null;
  /** How many entries the concern (or the unit, without one) now has, this one included. */
  count: number;
  loggedBy: string;
  occurredAt: string;
  hoursParked: number | null;
  ambientC: number | null;
  symptom: string;
  symptomText: string;
  batteryVolts: number | null;
  recovered: boolean | null;
  note: string;
  /** The entry carries a photo; the mail only says so (photos are served to signed-in people only). */
  hasPhoto?: boolean;
  /** Absolute link to the concern's page (or the unit's, when no concern is open). */
  url: string;
  timeZone?: string;
}

const RECOVERED: Record<string, string> = { true: "Yes, by itself", false: "No", null: "Not said" };

/** To the writer and the technician: the fault happened again, here is what the fleet saw. */
export function occurrenceLoggedMail(m: OccurrenceLoggedMail): RenderedMail {
  const what = symptomLabel(m.symptom, m.symptomText);
  const facts: [string, string][] = [
    ["When", formatDateTime(m.occurredAt, m.timeZone)],
    ["What it did", what],
    ["Parked before", m.hoursParked === null ? "Not given" : `${formatNumber(m.hoursParked, 1)} h`],
    ["Outside", m.ambientC === null ? "Not given" : `${formatTemperature(m.ambientC, "F")} (${formatTemperature(m.ambientC, "C")})`],
    ["Battery", m.batteryVolts === null ? "Not measured" : `${formatNumber(m.batteryVolts, 2)} V`],
    ["Came right by itself", RECOVERED[String(m.recovered)] ?? "Not said"],
    ["Logged by", `${m.loggedBy}, ${m.accountName}`],
  ];
  if (m.note) facts.push(["Note", m.note]);
  if (m.hasPhoto) facts.push(["Photo", "Attached: open the log to see it"]);
  const ordinal = m.count === 1 ? "first entry" : `entry ${m.count}`;
  return renderMail({
    subject: `${m.unitNumber}: ${what.toLowerCase()} — occurrence logged (${ordinal})`,
    heading: `${m.unitNumber} did it again`,
    paragraphs: [
      m.complaint
        ? `${m.loggedBy} logged an occurrence of “${m.complaint}” on ${m.unitNumber}. It is ${ordinal} in the log.`
        : `${m.loggedBy} logged an occurrence on ${m.unitNumber}; no intermittent concern is open on the unit yet.`,
    ],
    facts,
    action: { label: "Open the occurrence log", url: m.url },
  });
}
