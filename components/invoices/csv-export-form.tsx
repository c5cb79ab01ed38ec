import { inputClass } from "@/components/forms/field";
import { buttonClass } from "@/components/ui/button";

/** A plain GET form: the browser downloads the CSV from the API with the session it already has. */
export function CsvExportForm({ accountId, from, to }: { accountId: string; from: string; to: string }) {
  return (
    <form method="get" action={`/api/v1/accounts/${accountId}/export`} className="flex flex-wrap items-end gap-3" data-testid="csv-export">
      <label className="flex flex-col gap-1">
        <span className="font-semibold">From</span>
        <input type="date" name="from" defaultValue={from} required className={inputClass} />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">To</span>
        <input type="date" name="to" defaultValue={to} required className={inputClass} />
      </label>
      <button type="submit" className={buttonClass("secondary")}>
        Download CSV
      </button>
      <p className="w-full text-sm text-ink-faint">Invoices issued and payments received in these dates, one per row.</p>
    </form>
  );
}
