"use server";

import { revalidatePath } from "next/cache";
import { addPerson, setPersonActive } from "@/db/queries/people";
import { guardedAction } from "@/lib/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { newPersonInput, personActiveInput } from "@/lib/validation/people";

export const addPersonAction = guardedAction({ roles: CAN.manageShop, input: newPersonInput }, async ({ user, input }) => {
  const row = await addPerson(user, input);
  revalidatePath("/settings/people");
  return row;
});

export const personActiveAction = guardedAction({ roles: CAN.manageShop, input: personActiveInput }, async ({ user, input }) => {
  await setPersonActive(user, input.userId, input.active);
  revalidatePath("/settings/people");
  return null;
});
