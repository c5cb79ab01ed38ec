import "server-only";
import type { Tx } from "@/db/client";
import { photosOfOccurrences } from "@/db/queries/occurrence-photos";
import { occurrenceMailFacts, occurrenceRecipients } from "@/db/queries/occurrence-recipients";
import { env } from "@/lib/env";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { occurrenceLoggedMail } from "@/lib/mail/templates/occurrence-logged";

/** Queues, in the occurrence's own transaction, the e-mail to the writer and the technician about it. */
export async function queueOccurrenceNotice(tx: Tx, occurrenceId: string): Promise<void> {
  const facts = await occurrenceMailFacts(occurrenceId, tx);
  if (!facts) return;
  const o = facts.occurrence;
  const [to, photos] = await Promise.all([occurrenceRecipients(o.unitId, o.concernId, tx), photosOfOccurrences([o.id], tx)]);
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
  await queueMail(tx, { to, template: "occurrence-logged", mail });
}
