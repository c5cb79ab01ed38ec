"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { Money } from "@/components/ui/money";
import { bringBackAction } from "@/lib/server/actions/estimate";
import { formatDate } from "@/lib/format";

export interface DeferredOffer {
  id: string;
  description: string;
  amountCents: number;
  state: "held" | "declined";
  woLabel: string;
  decidedAt: string;
}

/** Held and declined work from the unit's earlier visits, offered back onto this one. */
export function DeferredOfferPanel({ workOrderId, offers }: { workOrderId: string; offers: DeferredOffer[] }) {
  const router = useRouter();
  const [picked, setPicked] = useState<string[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  if (!offers.length) return null;
  return (
    <section className="rounded-card border-2 border-dashed border-ink-soft p-3" aria-labelledby="deferred-offer" data-testid="deferred-offer">
      <h3 id="deferred-offer" className="font-bold">
        Deferred from earlier visits
      </h3>
      <p className="mb-2 text-sm text-ink-soft">The customer held or declined these before. Bring any back as draft lines to price again.</p>
      <ul className="flex flex-col gap-1">
        {offers.map((o) => (
          <li key={o.id}>
            <label className="flex min-h-touch items-center gap-3">
              <input
                type="checkbox"
                className="size-5 accent-rust"
                checked={picked.includes(o.id)}
                onChange={(e) => setPicked(e.target.checked ? [...picked, o.id] : picked.filter((p) => p !== o.id))}
              />
              <span className="flex-1">
                {o.description}
                <span className="block text-xs text-ink-faint">
                  {o.state === "held" ? "Held for later" : "Declined"} on {o.woLabel}, {formatDate(o.decidedAt)}
                </span>
              </span>
              <Money cents={o.amountCents} />
            </label>
          </li>
        ))}
      </ul>
      {error ? <p className="text-sm font-semibold text-rust-deep">{error}</p> : null}
      <Button
        type="button"
        variant="secondary"
        className="mt-2"
        disabled={!picked.length || pending}
        onClick={() =>
          start(async () => {
            const result = await bringBackAction({ workOrderId, lineIds: picked });
            if (!result.ok) setError(result.error);
            setPicked([]);
            router.refresh();
          })
        }
      >
        Bring back {picked.length || ""} as draft
      </Button>
    </section>
  );
}
