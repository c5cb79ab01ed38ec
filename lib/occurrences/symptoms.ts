/** What the unit did, as a short list a driver can tap; "other" asks for words. */
export const SYMPTOMS = ["no_start", "slow_crank", "stalled", "warning_lamp", "lost_power", "drifted", "other"] as const;
export type Symptom = (typeof SYMPTOMS)[number];

export const SYMPTOM_LABELS: Record<Symptom, string> = {
  no_start: "Would not start",
  slow_crank: "Cranked slowly",
  stalled: "Stalled or died",
  warning_lamp: "Warning lamp came on",
  lost_power: "Lost power",
  drifted: "Drifted or leaked down",
  other: "Something else",
};

export function symptomLabel(symptom: string, text = ""): string {
  const label = (SYMPTOM_LABELS as Record<string, string>)[symptom] ?? symptom;
  if (symptom === "other" && text) return text;
  return text ? `${label}: ${text}` : label;
}
