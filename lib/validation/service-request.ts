import { z } from "zod";
import { DEFECT_AREAS } from "@/lib/service-requests";

const reading = (label: string) =>
  z.preprocess((v) => (v === "" || v === null ? undefined : typeof v === "string" ? Number(v.replace(/,/g, "")) : v), z.number({ error: `${label} is a number.` }).finite().min(0, "A reading cannot be negative.").max(9_999_999).optional());

/** POST /api/v1/units/:id/service-requests: a driver's or foreman's defect report (49 CFR 396.11). */
export const serviceRequestInput = z.object({
  defects: z
    .array(
      z.object({
        area: z.preprocess((v) => (v === null ? "" : v), z.union([z.enum(DEFECT_AREAS), z.literal("")]).default("")),
        description: z.string().trim().min(1, "Say what is wrong.").max(500),
        outOfService: z.boolean().default(false),
      }),
    )
    .min(1, "Report at least one defect.")
    .max(20),
  odometer: reading("The odometer"),
  engineHours: reading("Engine hours"),
  note: z.string().trim().max(1000).default(""),
  photoId: z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().min(1).max(64).optional()),
});
export type ServiceRequestInput = z.output<typeof serviceRequestInput>;
