"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { addMeterReading } from "@/db/queries/meters";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { meterReadingInput } from "@/lib/validation/meter-reading";

export const addMeterReadingAction = guardedAction(
  { roles: CAN.anyone, input: meterReadingInput.extend({ unitId: z.string().min(1).max(64) }) },
  async ({ user, input }) => {
    const { unitId, ...reading } = input;
    const row = await addMeterReading(user, unitId, reading);
    revalidatePath(`/units/${unitId}`);
    revalidatePath(`/fleet/units/${unitId}`);
    return { id: row.id };
  },
);
