"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { saveLaborRate, updateShopSettings } from "@/db/queries/shop-settings";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { laborRateInput, shopSettingsInput } from "@/lib/validation/shop-settings";

export const shopSettingsAction = guardedAction({ roles: CAN.manageShop, input: shopSettingsInput }, async ({ user, input }) => {
  await updateShopSettings(user, input);
  revalidatePath("/settings");
  return null;
});

export const laborRateAction = guardedAction({ roles: CAN.manageShop, input: laborRateInput }, async ({ user, input }) => {
  await saveLaborRate(user, input);
  revalidatePath("/settings");
  return null;
});
