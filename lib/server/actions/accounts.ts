"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { createAccount, setSigningLimit, updateAccount } from "@/db/queries/account-writes";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { FORM_NAMES, accountContactsInput, accountFormInput, accountRefInput, signingLimitInput, toContactFields } from "@/lib/validation/account";

function refresh(accountId: string) {
  revalidatePath(`/accounts/${accountId}`);
  revalidatePath("/accounts");
}

/** Creates an account when the form has no id, else saves its changes (each one in the change log). */
export const saveAccountAction = guardedAction({ roles: CAN.manageAccounts, input: accountFormInput }, async ({ user, input }) => {
  if (!input.accountId) {
    const row = await createAccount(user, input.fields);
    refresh(row.id);
    return { accountId: row.id, changed: Object.keys(input.fields).length, created: true };
  }
  const result = await updateAccount(user, input.accountId, { fields: input.fields }, FORM_NAMES);
  refresh(input.accountId);
  return { accountId: input.accountId, changed: result.changed, created: false };
});

export const archiveAccountAction = guardedAction({ roles: CAN.manageAccounts, input: accountRefInput }, async ({ user, input }) => {
  const result = await updateAccount(user, input.accountId, { fields: {}, archived: input.archived });
  refresh(input.accountId);
  return { changed: result.changed };
});

export const saveContactsAction = guardedAction({ roles: CAN.manageAccounts, input: accountContactsInput }, async ({ user, input }) => {
  const result = await updateAccount(user, input.accountId, { fields: {}, contacts: input.contacts.map(toContactFields) });
  refresh(input.accountId);
  return { changed: result.changed };
});

export const signingLimitAction = guardedAction({ roles: CAN.manageAccounts, input: signingLimitInput }, async ({ user, input }) => {
  await setSigningLimit(user, input.userId, input.signingLimit);
  revalidatePath("/accounts");
  return null;
});
