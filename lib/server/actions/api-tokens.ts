"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { createToken, revokeToken } from "@/db/queries/api-tokens";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";

export const createTokenAction = guardedAction(
  { roles: CAN.anyone, input: z.object({ name: z.string().trim().min(1, "Name the token after the script that uses it.").max(80) }) },
  async ({ user, input }) => {
    const created = await createToken(user, input.name);
    revalidatePath("/settings/tokens");
    revalidatePath("/fleet/settings/tokens");
    return created;
  },
);

export const revokeTokenAction = guardedAction({ roles: CAN.anyone, input: z.object({ tokenId: z.string().min(1).max(64) }) }, async ({ user, input }) => {
  await revokeToken(user, input.tokenId);
  revalidatePath("/settings/tokens");
  revalidatePath("/fleet/settings/tokens");
  return null;
});
