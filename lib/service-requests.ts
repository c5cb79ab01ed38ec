/**
 * A defect report from the fleet in the shape of a driver's vehicle inspection
 * report, 49 CFR 396.11: it identifies the vehicle, lists each defect or
 * deficiency found that would affect safe operation or cause a breakdown, and
 * is signed by the driver (here: the signed-in person's name and the time).
 * The parts a driver's report must cover, 49 CFR 396.11(a)(1)(i)–(xi)
 * (from memory for the exact wording; check the current eCFR text):
 */
export const DVIR_AREAS = [
  "Service brakes and trailer brake connections",
  "Parking brake",
  "Steering",
  "Lights and reflectors",
  "Tires",
  "Horn",
  "Windshield wipers",
  "Mirrors",
  "Coupling devices",
  "Wheels and rims",
  "Emergency equipment",
] as const;

/** Anything else a driver finds (body, hydraulics, engine, a warning lamp). */
export const OTHER_AREA = "Other";
export const DEFECT_AREAS = [...DVIR_AREAS, OTHER_AREA] as const;
export type DefectArea = (typeof DEFECT_AREAS)[number];

/** A defect from a driver's report, as the visit's complaint: in the reporter's words, with who reported it. */
export function defectComplaint(d: { area: string; description: string; outOfService: boolean }, reporter: string): string {
  return `${d.area ? `${d.area}: ` : ""}${d.description} (reported by ${reporter}${d.outOfService ? ", out of service" : ""})`;
}
