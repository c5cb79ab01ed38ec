import { applyStripeEvent } from "@/db/queries/stripe-events";
import { errorResponse } from "@/lib/server/http/api-route";
import { HttpError, problemResponse } from "@/lib/http/problem";
import { readUpTo } from "@/lib/server/http/read-body";
import { queuePaymentFlagged, queuePaymentReceived } from "@/lib/server/notifications/invoices";
import { verifyWebhookEvent, type Stripe } from "@/lib/server/payments/stripe";

export const dynamic = "force-dynamic";

const MAX_BYTES = 512 * 1024;

/**
 * Signed events from the card-payment service. The signature is checked on the
 * exact bytes received; an unsigned or forged event is refused and changes
 * nothing. Each event takes effect once however often it arrives.
 */
export async function POST(request: Request): Promise<Response> {
  // Counted while it streams in: an oversize body is refused before it is all read.
  const tooLarge = () => problemResponse(new HttpError(413, "payload_too_large", "Payload too large", "The event is too large."));
  if (Number(request.headers.get("content-length") ?? "0") > MAX_BYTES) return tooLarge();
  const raw = request.body ? await readUpTo(request.body, MAX_BYTES) : Buffer.alloc(0);
  if (!raw) return tooLarge();
  let event: Stripe.Event;
  try {
    event = verifyWebhookEvent(raw, request.headers.get("stripe-signature"));
  } catch {
    return problemResponse(
      new HttpError(400, "invalid_signature", "Invalid signature", "The event's signature does not verify. Nothing was recorded."),
    );
  }
  try {
    // The receipt (and the shop's notice of a payment held for review) are queued with the payment itself.
    const result = await applyStripeEvent(event, async (tx, outcome) => {
      if (outcome.outcome !== "payment_recorded") return;
      await queuePaymentReceived(tx, outcome.paymentId);
      if (outcome.flagged) await queuePaymentFlagged(tx, outcome.paymentId);
    });
    return Response.json({ received: true, outcome: result.outcome });
  } catch (error) {
    // A failure rolls the event back; a 5xx makes the service deliver it again.
    return errorResponse(error);
  }
}
