import { z } from "zod";

export const markIntermittentInput = z.object({
  concernId: z.string().min(1).max(64),
  recordHint: z
    .string()
    .trim()
    .min(10, "Say what the fleet should write down each time (at least a few words).")
    .max(500, "Keep it under 500 characters: people read it on a phone."),
});

export const closeConcernInput = z.object({
  concernId: z.string().min(1).max(64),
  conclusion: z
    .string()
    .trim()
    .min(10, "Say what the cause was and what was done, in a sentence or two.")
    .max(2000, "Keep it under 2,000 characters."),
});
