import { z } from "zod";
import { WORK_ORDER_STATUSES } from "@/lib/domain";

export const statusMoveInput = z
  .object({
    status: z.enum(WORK_ORDER_STATUSES, { error: "Choose one of the statuses." }),
    note: z.string().trim().max(500, "Keep the note under 500 characters.").default(""),
    /** Releasing with lines still waiting for the customer: keep them for the unit's next visit, or decline them. */
    pendingLines: z.enum(["hold", "decline"], { error: "Choose hold or decline for the lines still waiting." }).optional(),
    pendingNote: z.string().trim().max(500, "Keep the note under 500 characters.").optional(),
  })
  .superRefine((v, ctx) => {
    if (v.pendingLines === "decline" && !v.pendingNote) {
      ctx.addIssue({ code: "custom", path: ["pendingNote"], message: "Say why the lines are declined: the customer reads this note." });
    }
  });

export type StatusMoveInput = z.output<typeof statusMoveInput>;
