import type { Metadata } from "next";
import Link from "next/link";
import { RetryMailButton } from "@/components/settings/retry-mail-button";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { MAIL_COUNT_CAP, outgoingMail, type MailStatus } from "@/db/queries/mail-outbox";
import { requirePageRole } from "@/lib/server/auth/page-access";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { formatDateTime, formatNumber } from "@/lib/format";

export const metadata: Metadata = { title: "Outgoing mail" };

const LABELS: Record<MailStatus, string> = { queued: "Waiting to send", sending: "Sending", sent: "Sent", failed: "Failed" };
const FILTERS: (MailStatus | "all")[] = ["all", "failed", "queued", "sent"];

/** The owner's view of every e-mail Cotter sends: what went, what waits for the mail server, what failed and can be sent again. */
export default async function OutgoingMailPage({ searchParams }: { searchParams: Promise<{ status?: string; cursor?: string }> }) {
  await requirePageRole(CAN.manageShop);
  const { status, cursor } = await searchParams;
  const filter = FILTERS.find((f) => f === status) ?? "all";
  const { messages, counts, nextCursor } = await outgoingMail({ status: filter === "all" ? undefined : filter, limit: 50, cursor });
  const e = env();
  const server = e.SMTP_URL ? new URL(e.SMTP_URL).host : null;
  return (
    <>
      <PageHeader title="Outgoing mail" kicker={server ? `Through ${server}` : "To the local mail catcher (no SMTP_URL set)"} />
      {server ? null : (
        <p className="mb-3 text-sm text-ink-soft">
          Without a mail server, messages go to the catcher that <code>npm run demo</code> starts; read them at{" "}
          <a href={`http://127.0.0.1:${e.FAKE_SMTP_HTTP_PORT}/messages`}>the mail catcher</a>.
        </p>
      )}
      <nav aria-label="Filter" className="mb-4 flex flex-wrap gap-2 text-sm">
        {FILTERS.map((f) => (
          <Link key={f} href={f === "all" ? "/settings/mail" : `/settings/mail?status=${f}`} aria-current={f === filter ? "page" : undefined} className="rounded-card border border-rule px-3 py-2 no-underline aria-[current=page]:border-rust aria-[current=page]:font-bold">
            {f === "all" ? "All" : LABELS[f]}
            {f === "all" ? "" : ` (${counts[f] >= MAIL_COUNT_CAP ? `${formatNumber(MAIL_COUNT_CAP)}+` : formatNumber(counts[f])})`}
          </Link>
        ))}
      </nav>
      {messages.length === 0 ? (
        <EmptyState title={filter === "failed" ? "Nothing has failed." : "No mail here yet."} />
      ) : (
        <Card>
          <ul className="divide-y divide-rule" data-testid="outgoing-mail">
            {messages.map((m) => (
              <li key={m.id} className="flex flex-wrap items-start justify-between gap-2 py-2" data-status={m.status}>
                <div className="min-w-0">
                  <p className="font-semibold">{m.subject}</p>
                  <p className="text-sm text-ink-faint">
                    to {m.to} · {formatDateTime(m.createdAt)} · <span className={m.status === "failed" ? "font-semibold text-rust-deep" : ""}>{LABELS[m.status]}</span>
                    {m.status === "sent" && m.sentAt ? ` ${formatDateTime(m.sentAt)}` : ""}
                    {m.status === "queued" && m.attempts > 0 ? ` · tried ${m.attempts} time${m.attempts === 1 ? "" : "s"}, next at ${formatDateTime(m.sendAfter)}` : ""}
                    {m.status === "queued" && m.attempts === 0 && m.sendAfter > m.createdAt ? ` · goes at ${formatDateTime(m.sendAfter)}` : ""}
                  </p>
                  {m.lastError && m.status !== "sent" ? <p className="text-sm text-rust-deep">{m.lastError}</p> : null}
                </div>
                {m.retryable ? <RetryMailButton id={m.id} /> : null}
              </li>
            ))}
          </ul>
          {nextCursor ? (
            <p className="mt-3">
              <Link href={`/settings/mail?${new URLSearchParams({ ...(filter === "all" ? {} : { status: filter }), cursor: nextCursor })}`}>Older messages</Link>
            </p>
          ) : null}
        </Card>
      )}
    </>
  );
}
