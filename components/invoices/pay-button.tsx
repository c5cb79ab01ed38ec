"use client";

import { useState } from "react";
import { ApiError, fetchJson } from "@/components/data/fetcher";
import { Button } from "@/components/ui/button";
import { Money } from "@/components/ui/money";

/** Opens the card-payment page for the open balance; the payment is recorded when the service confirms it. */
export function PayButton({ invoiceId, balanceCents }: { invoiceId: string; balanceCents: number }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function pay() {
    setBusy(true);
    setError(null);
    try {
      const { url } = await fetchJson<{ url: string }>(`/api/v1/invoices/${invoiceId}/checkout`, { method: "POST" });
      window.location.assign(url);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The payment page could not be opened. Try again in a minute.");
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <Button type="button" onClick={pay} disabled={busy} className="w-full sm:w-auto">
        {busy ? "Opening the payment page…" : (
          <>
            Pay <Money cents={balanceCents} /> by card
          </>
        )}
      </Button>
      {error ? (
        <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 text-sm font-semibold text-rust-deep">
          {error}
        </p>
      ) : null}
    </div>
  );
}
