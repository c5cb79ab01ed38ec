"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { retryMail } from "@/db/queries/mail-outbox";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { kickMailWorker } from "@/lib/server/mail/worker";

export const retryMailAction = guardedAction({ roles: CAN.manageShop, input: z.object({ id: z.string().min(1).max(64) }) }, async ({ user, input }) => {
  await retryMail(user, input.id);
  kickMailWorker();
  revalidatePath("/settings/mail");
  return null;
});
