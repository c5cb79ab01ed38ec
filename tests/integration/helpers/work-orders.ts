import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { estimateLines, workOrders } from "@/db/schema";

export async function workOrderByNumber(number: number) {
  const [wo] = await getDb().select().from(workOrders).where(eq(workOrders.number, number)).limit(1);
  if (!wo) throw new Error(`no W-${number}`);
  return wo;
}

export async function linesOf(workOrderId: string) {
  return getDb().select().from(estimateLines).where(eq(estimateLines.workOrderId, workOrderId)).orderBy(estimateLines.position);
}

export async function lineByDescription(workOrderId: string, text: string) {
  const line = (await linesOf(workOrderId)).find((l) => l.description.includes(text));
  if (!line) throw new Error(`no line “${text}”`);
  return line;
}
