"use server";

import { revalidatePath } from "next/cache";
import { setSigningLimit, updateAccountSettings } from "@/db/queries/accounts";
import { guardedAction } from "@/lib/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { accountSettingsInput, signingLimitInput } from "@/lib/validation/account";

export const updateAccountAction = guardedAction({ roles: CAN.manageAccounts, input: accountSettingsInput }, async ({ user, input }) => {
  const result = await updateAccountSettings(user, input);
  revalidatePath(`/accounts/${input.accountId}`);
  revalidatePath("/accounts");
  return result;
});

export const signingLimitAction = guardedAction({ roles: CAN.manageAccounts, input: signingLimitInput }, async ({ user, input }) => {
  await setSigningLimit(user, input.userId, input.signingLimit);
  revalidatePath("/accounts");
  return null;
});
