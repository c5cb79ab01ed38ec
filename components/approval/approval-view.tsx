"use client";

import { useRouter } from "next/navigation";
import { Fragment, useEffect, useRef, useState, type ReactNode } from "react";
import useSWR from "swr";
import { ApiError, fetchJson, LIVE_REFRESH_MS } from "@/components/data/fetcher";
import { DecisionLog } from "@/components/estimate/decision-log";
import { PhotoStrip } from "@/components/findings/photo-strip";
import { TotalsBar } from "@/components/estimate/totals-bar";
import { Card, CardTitle } from "@/components/ui/card";
import { ShowMore } from "@/components/ui/show-more";
import type { Decision } from "@/lib/domain";
import { asSentence } from "@/lib/format";
import { ApprovalLine } from "./approval-line";
import { ApproveWhatFits, type Colleague } from "./approve-what-fits";
import { serverPartsKey, type ApprovalData } from "./approval-data";
import { LimitsPanel } from "./limits-panel";

/** The line a link points at (`#line-<id>`), read after hydration so the server and first client render agree. */
function useLinkedLine(): string | null {
  const [id, setId] = useState<string | null>(null);
  useEffect(() => {
    const read = () => setId(window.location.hash.startsWith("#line-") ? window.location.hash.slice("#line-".length) : null);
    read();
    window.addEventListener("hashchange", read);
    return () => window.removeEventListener("hashchange", read);
  }, []);
  return id;
}

async function post(url: string, body: unknown) {
  return fetchJson(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
}

/**
 * The approver's page: every line waiting on them, grouped by concern, with
 * Approve / Decline / Hold for later and Approve all. The server checks every
 * limit; a refusal comes back in words and amounts and is shown on the line.
 */
export function ApprovalView({
  initial,
  canDecide,
  taxExempt,
  colleagues = [],
  outOfService,
  findingCards,
  timeline,
  partsKey,
  pageSize,
}: {
  /** Only what this component updates live; the findings and the timeline come rendered by the server. */
  initial: ApprovalData;
  canDecide: boolean;
  taxExempt: boolean;
  colleagues?: Colleague[];
  /** The Out of service section (findings with their notes, rendered on the server), or null. */
  outOfService: ReactNode;
  /** Every other finding's card, rendered on the server, by finding id. */
  findingCards: Record<string, ReactNode>;
  timeline: ReactNode;
  /** serverPartsKey() of what the server rendered: when the polled view differs, the server parts are fetched again. */
  partsKey: string;
  /** Lines drawn at first and per "show the next": the API's page size, so a 250-line estimate is not 250 rows of markup at once. */
  pageSize: number;
}) {
  const key = `/api/v1/work-orders/${initial.id}`;
  // The polled answer is the whole API view; this page reads the ApprovalData part of it.
  const { data, mutate } = useSWR<ApprovalData>(key, fetchJson, { fallbackData: initial, refreshInterval: LIVE_REFRESH_MS });
  const view = data ?? initial;
  const router = useRouter();
  const liveKey = serverPartsKey(view);
  useEffect(() => {
    // A new finding or update from the shop: ask the server for the parts it renders.
    if (liveKey !== partsKey && liveKey !== "") router.refresh();
  }, [liveKey, partsKey, router]);
  const [busy, setBusy] = useState(false);
  const [refusals, setRefusals] = useState<Record<string, string>>({});
  const [banner, setBanner] = useState<{ kind: "ok" | "refused"; text: string } | null>(null);

  const pending = view.lines.filter((l) => l.state === "proposed");
  // Out of service comes before anything else; other findings sit with their concern.
  const otherFindings = view.findings.filter((f) => f.severity !== "out_of_service");
  const findingById = new Map(view.findings.map((f) => [f.id, f]));
  const groups = [
    ...view.concerns.map((c, i) => ({ id: c.id, title: `${i + 1}. ${c.complaint}`, cause: c.cause })),
    { id: "", title: "Other work", cause: "" },
  ];

  async function run(action: () => Promise<unknown>, lineId: string | null, success: string) {
    setBusy(true);
    setBanner(null);
    try {
      await action();
      setRefusals((r) => {
        const next = { ...r };
        if (lineId) delete next[lineId];
        return next;
      });
      setBanner({ kind: "ok", text: success });
    } catch (error) {
      let text = error instanceof ApiError ? asSentence(error.message) : "Cotter could not be reached. Nothing was decided; try again.";
      if (error instanceof ApiError && error.code === "signing_limit_exceeded") {
        text += " Another approver on your account with a higher signing limit can approve it.";
      }
      const refusedLine = error instanceof ApiError ? ((error.body as { lineId?: string } | null)?.lineId ?? lineId) : lineId;
      if (refusedLine) setRefusals((r) => ({ ...r, [refusedLine]: text }));
      setBanner({ kind: "refused", text });
    } finally {
      setBusy(false);
      await mutate();
    }
  }

  const decideOne = (lineId: string, version: number, decision: Decision, note: string) =>
    run(() => post(`/api/v1/lines/${lineId}/decision`, { decision, expectedVersion: version, ...(note ? { note } : {}) }), lineId, "Decision saved. The shop has been told.");

  const approveSome = (lines: typeof pending, success: string) =>
    run(() => post(`/api/v1/work-orders/${view.id}/decisions`, { decisions: lines.map((l) => ({ lineId: l.id, decision: "approve", expectedVersion: l.version })) }), null, success);
  // Every line in the order the page shows them (by concern, then the rest). All are in the data
  // (totals, limits and "approve what fits" cover them all); only the rows drawn are paged.
  const ordered = groups.flatMap((g) => view.lines.filter((l) => (l.concernId ?? "") === g.id));
  const shownWaiting = ordered.filter((l) => l.state === "proposed");
  const [shown, setShown] = useState(pageSize);
  // A link to one line (the pass-on e-mail's) draws as many pages as it takes to reach it, and scrolls there once.
  const linkedLine = useLinkedLine();
  const linkedAt = ordered.findIndex((l) => l.id === linkedLine);
  const count = linkedAt >= shown ? Math.ceil((linkedAt + 1) / pageSize) * pageSize : shown;
  const drawn = new Set(ordered.slice(0, count).map((l) => l.id));
  // The decision log, newest first, a page at a time too.
  const [decisionsShown, setDecisionsShown] = useState(pageSize);
  const lineById = new Map(view.lines.map((l) => [l.id, l]));
  const reached = useRef<string | null>(null);
  useEffect(() => {
    if (!linkedLine || linkedAt < 0 || reached.current === linkedLine) return;
    reached.current = linkedLine;
    document.getElementById(`line-${linkedLine}`)?.scrollIntoView();
  }, [linkedLine, linkedAt]);

  return (
    <div className="flex flex-col gap-4">
      {outOfService}
      <LimitsPanel limits={view.limits} closed={view.status === "released"} />
      {banner ? (
        <p
          role={banner.kind === "refused" ? "alert" : "status"}
          className={`rounded-card border-2 px-3 py-2 text-sm font-semibold ${banner.kind === "refused" ? "border-rust bg-rust-wash text-rust-deep" : "border-ink bg-paper"}`}
          data-testid="approval-banner"
        >
          {banner.text}
        </p>
      ) : null}
      {canDecide && view.status !== "released" && pending.length > 0 ? (
        <ApproveWhatFits
          view={view}
          waiting={shownWaiting}
          colleagues={colleagues}
          busy={busy}
          onApprove={(lines, success) => void approveSome(lines, success)}
          onPassed={(text, ok) => {
            setBanner({ kind: ok ? "ok" : "refused", text });
            void mutate();
          }}
        />
      ) : null}
      {!canDecide ? <p className="text-sm text-ink-soft">Only your account&apos;s approvers can decide on these lines.</p> : null}
      {groups.map((g) => {
        const lines = view.lines.filter((l) => (l.concernId ?? "") === g.id && drawn.has(l.id));
        const found = otherFindings.filter((f) => (f.concernId ?? "") === g.id);
        if (!lines.length && !found.length) return null;
        return (
          <section key={g.id || "other"} aria-label={g.title}>
            <h2 className="text-lg font-bold">{g.title}</h2>
            {g.cause ? <p className="mb-1 text-sm text-ink-soft">What the technician found: {g.cause}</p> : null}
            {found.length ? (
              <div className="mb-2 flex flex-col gap-2">
                {found.map((f) => (
                  <Fragment key={f.id}>{findingCards[f.id] ?? null}</Fragment>
                ))}
              </div>
            ) : null}
            <ul className="flex flex-col gap-2">
              {lines.map((line) => (
                <ApprovalLine
                  key={line.id}
                  line={line}
                  canDecide={canDecide}
                  busy={busy}
                  refusal={refusals[line.id] ?? null}
                  onDecide={(decision, note) => void decideOne(line.id, line.version, decision, note)}
                >
                  {line.findingId && findingById.get(line.findingId) ? (
                    <div className="mt-2 border-t border-rule pt-2 text-sm">
                      <p className="text-ink-soft">From the finding “{findingById.get(line.findingId)!.title}”</p>
                      <PhotoStrip photos={findingById.get(line.findingId)!.photos} title={findingById.get(line.findingId)!.title} />
                    </div>
                  ) : null}
                </ApprovalLine>
              ))}
            </ul>
          </section>
        );
      })}
      <ShowMore drawn={drawn.size} total={ordered.length} noun="lines" pageSize={pageSize} note="The totals and your limits above count all of them." onMore={() => setShown(count + pageSize)} testId="lines-drawn" />
      <TotalsBar totals={view.totals} ifAllPendingApprovedCents={view.estimateTotals.ifAllPendingApprovedCents} taxExempt={taxExempt} />
      <Card>
        <CardTitle>Decisions</CardTitle>
        <DecisionLog entries={view.decisionLog.slice(0, decisionsShown)} describe={(lineId) => lineById.get(lineId)?.description ?? "Removed line"} />
        <ShowMore drawn={Math.min(decisionsShown, view.decisionLog.length)} total={view.decisionLog.length} noun="decisions" pageSize={pageSize} onMore={() => setDecisionsShown((n) => n + pageSize)} />
      </Card>
      {timeline}
    </div>
  );
}
