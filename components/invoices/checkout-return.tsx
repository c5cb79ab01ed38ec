"use client";

import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";

const POLL_MS = 1_500;
const GIVE_UP_MS = 60_000;

/**
 * What the payer sees on coming back from the payment page. The return itself
 * proves nothing: the invoice changes only when the service's signed
 * confirmation arrives, so this waits for that and refreshes the page.
 */
export function CheckoutReturn({ outcome, settled }: { outcome: "returned" | "cancelled"; settled: boolean }) {
  const router = useRouter();
  const [gaveUp, setGaveUp] = useState(false);
  useEffect(() => {
    if (outcome !== "returned" || settled) return;
    const started = Date.now();
    const timer = setInterval(() => {
      if (Date.now() - started > GIVE_UP_MS) {
        setGaveUp(true);
        clearInterval(timer);
      } else router.refresh();
    }, POLL_MS);
    return () => clearInterval(timer);
  }, [outcome, settled, router]);

  if (outcome === "cancelled") {
    return (
      <p role="status" className="rounded-card border-2 border-ink bg-paper-card px-3 py-2 font-semibold">
        No payment was taken. The invoice is still open; you can pay it whenever you are ready.
      </p>
    );
  }
  if (settled) {
    return (
      <p role="status" className="rounded-card border-2 border-ink bg-paper-card px-3 py-2 font-semibold" data-testid="payment-confirmed">
        Payment received. Thank you; a receipt is on its way by e-mail.
      </p>
    );
  }
  return (
    <p role="status" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 font-semibold text-rust-deep" data-testid="payment-pending">
      {gaveUp
        ? "The card service has not confirmed the payment yet. Nothing more is needed from you; this page will show it once it arrives."
        : "Waiting for the card service to confirm your payment…"}
    </p>
  );
}
