import { describeChange } from "@/lib/audit-format";
import { formatDateTime } from "@/lib/format";

/** Every audited change of an account, each field's old and new value in words. */
export function ChangeLog({ entries }: { entries: { id: string; at: string; actor: string; action: string; detail: unknown }[] }) {
  if (entries.length === 0) return <p className="text-sm text-ink-faint">No changes yet.</p>;
  return (
    <ul className="divide-y divide-rule text-sm" data-testid="change-log">
      {entries.map((c) => (
        <li key={c.id} className="py-2">
          <p>
            <span className="font-semibold">{formatDateTime(c.at)}</span> · {c.actor}
            {c.action === "account.created" ? " · created the account" : ""}
          </p>
          <ul className="mt-1 text-ink-soft">
            {describeChange(c.detail).map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </li>
      ))}
    </ul>
  );
}
