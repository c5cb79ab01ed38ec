import type { IncomingMessage, ServerResponse } from "node:http";
import type { Checkout } from "./checkout";
import { readBody, redirect, sendHtml } from "./http-util";
import { noticePage, paymentPage, type FormState } from "./page";
import type { SessionRecord } from "./types";

export const TEST_CARDS = { pays: "4242424242424242", declined: "4000000000000002" } as const;
export const DECLINED_MESSAGE = "Your card was declined. No payment was taken.";
export const USE_TEST_CARD_MESSAGE =
  "Use a test card number: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.";

/** `GET /pay/:id` shows the page; `POST /pay/:id` takes the card form. */
export async function handlePage(req: IncomingMessage, res: ServerResponse, checkout: Checkout, id: string): Promise<void> {
  const record = checkout.find(id);
  if (!record) {
    sendHtml(res, 404, noticePage("Payment not found", "This payment link does not exist on the local test service."));
    return;
  }
  if (record.session.status !== "open") {
    sendClosed(res, record);
    return;
  }
  if (req.method === "GET") {
    sendHtml(res, 200, paymentPage(record));
    return;
  }
  const form = new URLSearchParams(await readBody(req));
  const cardNumber = (form.get("card_number") ?? "").replace(/[\s-]/g, "");
  const expiry = (form.get("expiry") ?? "").trim();
  const cvc = (form.get("cvc") ?? "").trim();
  const state: FormState = {
    fieldErrors: {},
    values: { card_number: form.get("card_number") ?? "", expiry },
  };
  const errors = state.fieldErrors ?? {};
  const testCard = cardNumber === TEST_CARDS.pays || cardNumber === TEST_CARDS.declined;
  if (!testCard) errors.card_number = "This is not one of the test card numbers.";
  const expiryError = checkExpiry(expiry);
  if (expiryError) errors.expiry = expiryError;
  if (!/^\d{3,4}$/.test(cvc)) errors.cvc = "Enter the 3 or 4 digit security code.";
  if (Object.keys(errors).length > 0) {
    state.formError = testCard ? "Check the card details below." : USE_TEST_CARD_MESSAGE;
    sendHtml(res, 422, paymentPage(record, state));
    return;
  }
  const outcome = checkout.pay(record, cardNumber === TEST_CARDS.pays ? "approve" : "decline");
  if (outcome.kind === "paid") {
    redirect(res, outcome.redirectTo);
    return;
  }
  state.formError = DECLINED_MESSAGE;
  sendHtml(res, 402, paymentPage(record, state));
}

function sendClosed(res: ServerResponse, record: SessionRecord): void {
  const s = record.session;
  if (s.status === "complete") {
    const link = s.success_url ? { href: s.success_url.replaceAll("{CHECKOUT_SESSION_ID}", s.id), text: "Continue" } : undefined;
    sendHtml(res, 409, noticePage("Already paid", "This payment is already complete. Nothing more is needed.", link));
    return;
  }
  const link = s.cancel_url ? { href: s.cancel_url, text: "Go back" } : undefined;
  sendHtml(res, 410, noticePage("Payment link expired", "This payment link has expired. No payment was taken.", link));
}

/** "MM / YY", "MM/YY" or "MMYY"; must not be in the past. */
function checkExpiry(text: string): string | null {
  const m = /^(\d{2})\s*\/?\s*(\d{2})$/.exec(text);
  if (!m) return "Enter the expiry as MM / YY.";
  const month = Number(m[1]);
  const year = 2000 + Number(m[2]);
  if (month < 1 || month > 12) return "The expiry month must be 01 to 12.";
  const now = new Date();
  const current = now.getUTCFullYear() * 12 + now.getUTCMonth() + 1;
  if (year * 12 + month < current) return "This card has expired. Use any future month.";
  return null;
}
