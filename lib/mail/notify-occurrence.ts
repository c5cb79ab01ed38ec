import { photosOfOccurrences } from "@/db/queries/occurrence-photos";
import { occurrenceMailFacts, occurrenceRecipients } from "@/db/queries/occurrence-recipients";
import { env } from "@/lib/env";
import { appUrl, sendMail } from "./send";
import { occurrenceLoggedMail } from "./templates/occurrence-logged";

/** E-mails the writer and the technician about a new occurrence; never throws (sendMail logs failures). */
export async function notifyOccurrence(occurrenceId: string): Promise<{ sent: number; failed: number }> {
  const facts = await occurrenceMailFacts(occurrenceId);
  if (!facts) return { sent: 0, failed: 0 };
  const o = facts.occurrence;
  const [to, photos] = await Promise.all([occurrenceRecipients(o.unitId, o.concernId), photosOfOccurrences([o.id])]);
  const mail = occurrenceLoggedMail({
    unitNumber: facts.unitNumber,
    accountName: facts.accountName,
    complaint: facts.complaint,
    count: facts.count,
    loggedBy: facts.loggedBy ?? "Someone",
    occurredAt: o.occurredAt,
    hoursParked: o.hoursParked,
    ambientC: o.ambientC,
    symptom: o.symptom,
    symptomText: o.symptomText,
    batteryVolts: o.batteryVolts,
    recovered: o.recovered,
    note: o.note,
    hasPhoto: photos.has(o.id),
    url: appUrl(o.concernId ? `/concerns/${o.concernId}` : `/units/${o.unitId}#occurrences`),
    timeZone: env().APP_TIME_ZONE,
  });
  return sendMail(to, mail, "occurrence-logged");
}
