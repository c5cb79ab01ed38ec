import type { Metadata } from "next";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { formatDateTime } from "@/lib/format";

export const metadata: Metadata = { title: "Caught mail" };
export const dynamic = "force-dynamic";

interface Caught {
  id: string;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
  attachments: { filename: string; size: number }[];
}

/** The owner's view of the local mail catcher: what Cotter would have e-mailed, with no mail server set up. */
export default async function CaughtMailPage() {
  await requirePageRole(CAN.manageShop);
  const e = env();
  if (e.SMTP_URL) {
    return (
      <>
        <PageHeader title="Caught mail" />
        <p>Mail goes to a real SMTP server ({new URL(e.SMTP_URL).host}); nothing is caught here.</p>
      </>
    );
  }
  const messages = await fetch(`http://127.0.0.1:${e.FAKE_SMTP_HTTP_PORT}/messages`, { cache: "no-store" })
    .then((r) => r.json() as Promise<{ messages: Caught[] }>)
    .then((b) => b.messages)
    .catch(() => null);
  return (
    <>
      <PageHeader title="Caught mail" kicker="Local mail catcher (no SMTP server configured)" />
      {messages === null ? (
        <EmptyState title="The mail catcher is not running.">Start it with `npm run mocks` (npm run demo starts it for you).</EmptyState>
      ) : messages.length === 0 ? (
        <EmptyState title="No mail yet." />
      ) : (
        <ul className="flex flex-col gap-3">
          {messages.map((m) => (
            <li key={m.id} className="rounded-card border border-rule bg-paper-card p-3">
              <details>
                <summary className="cursor-pointer">
                  <span className="font-semibold">{m.subject}</span>
                  <span className="block text-sm text-ink-faint">
                    to {m.to.join(", ")} · {formatDateTime(m.receivedAt)}
                    {m.attachments.length ? ` · ${m.attachments.map((a) => a.filename).join(", ")}` : ""}
                  </span>
                </summary>
                <pre className="mt-2 text-sm whitespace-pre-wrap">{m.text}</pre>
              </details>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
