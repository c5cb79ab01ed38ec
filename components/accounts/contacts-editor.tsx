"use client";

import { useState, useTransition } from "react";
import { inputClass } from "@/components/forms/field";
import { Button } from "@/components/ui/button";
import { saveContactsAction } from "@/lib/server/actions/accounts";

export interface ContactRow {
  name: string;
  role: string;
  email: string;
  phone: string;
  billing: boolean;
}

const blank: ContactRow = { name: "", role: "", email: "", phone: "", billing: false };

/** The fleet's contacts, edited as a list and saved together (the change log shows the list before and after). */
export function ContactsEditor({ accountId, initial }: { accountId: string; initial: ContactRow[] }) {
  const [rows, setRows] = useState<ContactRow[]>(initial);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  const set = (i: number, patch: Partial<ContactRow>) => setRows(rows.map((r, j) => (j === i ? { ...r, ...patch } : r)));
  return (
    <div className="flex flex-col gap-3" data-testid="contacts-editor">
      {rows.length === 0 ? <p className="text-ink-faint">No contacts yet.</p> : null}
      {rows.map((r, i) => (
        <fieldset key={i} className="grid gap-2 rounded-card border border-rule p-3 md:grid-cols-[1fr_1fr_1fr_10rem_auto]">
          <legend className="sr-only">Contact {i + 1}</legend>
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Name
            <input value={r.name} onChange={(e) => set(i, { name: e.target.value })} className={inputClass} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Role at the fleet
            <input value={r.role} onChange={(e) => set(i, { role: e.target.value })} placeholder="e.g. fleet manager" className={inputClass} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-semibold">
            E-mail
            <input type="email" value={r.email} onChange={(e) => set(i, { email: e.target.value })} className={inputClass} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Phone
            <input type="tel" value={r.phone} onChange={(e) => set(i, { phone: e.target.value })} className={inputClass} />
          </label>
          <div className="flex items-end gap-3">
            <label className="flex min-h-touch items-center gap-2 text-sm">
              <input type="checkbox" checked={r.billing} onChange={(e) => set(i, { billing: e.target.checked })} className="size-5 accent-rust" />
              Billing
            </label>
            <Button type="button" variant="quiet" onClick={() => setRows(rows.filter((_, j) => j !== i))}>
              Remove
            </Button>
          </div>
        </fieldset>
      ))}
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="secondary" onClick={() => setRows([...rows, blank])}>
          + Add a contact
        </Button>
        <Button
          type="button"
          disabled={pending}
          onClick={() =>
            start(async () => {
              const result = await saveContactsAction({ accountId, contacts: rows });
              setMessage(
                result.ok
                  ? { ok: true, text: result.data.changed ? "Contacts saved; the change log shows them before and after." : "Nothing changed." }
                  : { ok: false, text: [result.error, ...Object.entries(result.fieldErrors ?? {}).map(([k, v]) => `${describePath(k)}: ${v}`)].join(" ") },
              );
            })
          }
        >
          {pending ? "Saving…" : "Save contacts"}
        </Button>
      </div>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "font-semibold" : "font-semibold text-rust-deep"}>
          {message.text}
        </p>
      ) : null}
    </div>
  );
}

/** "contacts.1.email" → "Contact 2, e-mail". */
function describePath(path: string): string {
  const m = /^contacts\.(\d+)\.(\w+)$/.exec(path);
  return m ? `Contact ${Number(m[1]) + 1}, ${m[2] === "email" ? "e-mail" : m[2]}` : path;
}
