import type { z } from "zod";
import type { FieldProblem } from "./problem";

export function fieldProblems(error: z.ZodError): FieldProblem[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join(".") || "(body)",
    message: issue.message,
  }));
}

/** Field errors keyed by field name, the shape forms show beside each input. */
export function fieldErrorMap(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const p of fieldProblems(error)) out[p.path] ??= p.message;
  return out;
}
