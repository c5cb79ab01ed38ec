import type { LineKind } from "@/lib/domain";
import { formatQuantity } from "@/lib/format";

/** Labour reads in hours ("2.3 h"); other kinds as a plain quantity. */
export function formatQuantityOf(milli: number, kind: LineKind): string {
  return kind === "labor" ? `${formatQuantity(milli)} h` : formatQuantity(milli);
}

export const PAYMENT_METHOD_LABELS: Record<string, string> = {
  card: "Card",
  cheque: "Cheque",
  transfer: "Bank transfer",
  cash: "Cash",
};
