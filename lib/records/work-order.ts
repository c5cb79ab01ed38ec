import { workOrderLabel, type WorkOrderStatus } from "../domain";

/** The stored fields of a work order every answer about one carries. */
export interface WorkOrderFields {
  id: string;
  number: number;
  unitId: string;
  accountId: string;
  status: WorkOrderStatus;
  title: string;
  promisedAt: string | null;
  updatedAt: string;
}

/**
 * A work order on the way out, the one shape of its own fields: api-v1.md's
 * `{ id, number, unitId, accountId, status, promisedAt, updatedAt }` with the
 * label people read ("W-1042") and the title. Lists, the detail, a status move
 * and a check-in add their own fields beside these.
 */
export function workOrderOut(w: WorkOrderFields) {
  return {
    id: w.id,
    number: w.number,
    label: workOrderLabel(w.number),
    unitId: w.unitId,
    accountId: w.accountId,
    status: w.status,
    title: w.title,
    promisedAt: w.promisedAt,
    updatedAt: w.updatedAt,
  };
}

export type WorkOrderOut = ReturnType<typeof workOrderOut>;
