import { z } from "zod";
import { WORK_ORDER_STATUSES } from "@/lib/domain";

export const statusMoveInput = z.object({
  status: z.enum(WORK_ORDER_STATUSES, { error: "Choose one of the statuses." }),
  note: z.string().trim().max(500, "Keep the note under 500 characters.").default(""),
});

export type StatusMoveInput = z.output<typeof statusMoveInput>;
