import { emptyString, invalidInteger, invalidParam, missingParam, noSuch, unknownParam } from "./errors";
import type { FormObject, FormValue } from "./form";
import type { NewSessionInput } from "./objects";
import { nowSeconds, randomId } from "./store";
import type { StoredLineItem } from "./types";

/**
 * Validates `POST /v1/checkout/sessions` for mode=payment. Parameter names and
 * limits come from the SDK's SessionCreateParams (esm/resources/Checkout/Sessions.d.ts):
 * line_items required in payment mode, at most 100; expires_at 30 min – 24 h after creation.
 */
export interface CreateSessionParams extends Omit<NewSessionInput, "url"> {
  paymentIntentData: { metadata: Record<string, string>; description: string | null };
  expand: string[];
}

const TOP_LEVEL = new Set([
  "mode", "line_items", "currency", "success_url", "cancel_url", "client_reference_id", "metadata",
  "customer_email", "payment_intent_data", "expires_at", "expand", "ui_mode", "payment_method_types",
]);
const DAY = 24 * 60 * 60;

function isObject(v: FormValue | undefined): v is FormObject {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function onlyKeys(obj: FormObject, allowed: string[], path: (k: string) => string): void {
  for (const k of Object.keys(obj)) if (!allowed.includes(k)) throw unknownParam(path(k));
}

function optString(obj: FormObject, key: string, param: string): string | undefined {
  const v = obj[key];
  if (v === undefined) return undefined;
  if (typeof v !== "string") throw invalidParam(param, `Invalid string: ${param} must be a string`);
  return v;
}

function reqString(obj: FormObject, key: string, param: string): string {
  const v = optString(obj, key, param);
  if (v === undefined) throw missingParam(param);
  if (v === "") throw emptyString(param);
  return v;
}

function integer(value: string, param: string, min: number): number {
  if (!/^-?\d+$/.test(value) || !Number.isSafeInteger(Number(value))) throw invalidInteger(param, value);
  const n = Number(value);
  if (n < min) throw invalidParam(param, `This value must be greater than or equal to ${min}.`);
  return n;
}

function url(obj: FormObject, key: string, required: boolean): string | null {
  const v = required ? reqString(obj, key, key) : optString(obj, key, key);
  if (v === undefined || v === "") return null;
  const ok = URL.canParse(v) && /^https?:$/.test(new URL(v).protocol);
  if (!ok) throw invalidParam(key, "Not a valid URL", "url_invalid");
  return v;
}

function email(value: string | undefined): string | null {
  if (value === undefined || value === "") return null;
  if (!/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(value)) {
    throw invalidParam("customer_email", `Invalid email address: ${value}`, "email_invalid");
  }
  return value;
}

function currency(value: string, param: string): string {
  const c = value.toLowerCase();
  if (!/^[a-z]{3}$/.test(c)) throw invalidParam(param, `Invalid currency: ${value}.`);
  return c;
}

// Limits from the public metadata docs: 50 keys, 40-character keys, 500-character values.
export function metadata(value: FormValue | undefined, param: string): Record<string, string> {
  if (value === undefined || value === "") return {};
  if (!isObject(value)) throw invalidParam(param, `Invalid object: ${param} must be a hash of strings`);
  const out: Record<string, string> = {};
  const keys = Object.keys(value);
  if (keys.length > 50) throw invalidParam(param, `${param} can have at most 50 keys.`);
  for (const k of keys) {
    const v = value[k];
    if (typeof v !== "string") throw invalidParam(`${param}[${k}]`, "Metadata values must be strings.");
    if (k.length > 40) throw invalidParam(`${param}[${k}]`, "Metadata keys can be at most 40 characters.");
    if (v.length > 500) throw invalidParam(`${param}[${k}]`, "Metadata values can be at most 500 characters.");
    if (v !== "") out[k] = v;
  }
  return out;
}

function lineItem(value: FormValue, i: number): StoredLineItem {
  const p = `line_items[${i}]`;
  if (!isObject(value)) throw invalidParam(p, `Invalid object: ${p}`);
  onlyKeys(value, ["price", "price_data", "quantity", "metadata"], (k) => `${p}[${k}]`);
  const price = optString(value, "price", `${p}[price]`);
  if (price !== undefined) throw noSuch("price", price, `${p}[price]`);
  const pd = value.price_data;
  if (!isObject(pd)) throw missingParam(`${p}[price_data]`);
  const pdp = `${p}[price_data]`;
  onlyKeys(pd, ["currency", "product_data", "unit_amount", "unit_amount_decimal"], (k) => `${pdp}[${k}]`);
  const prod = pd.product_data;
  if (!isObject(prod)) throw missingParam(`${pdp}[product_data]`);
  onlyKeys(prod, ["name", "description", "metadata"], (k) => `${pdp}[product_data][${k}]`);
  const rawAmount = optString(pd, "unit_amount", `${pdp}[unit_amount]`);
  const rawDecimal = optString(pd, "unit_amount_decimal", `${pdp}[unit_amount_decimal]`);
  if (rawAmount === undefined && rawDecimal === undefined) throw missingParam(`${pdp}[unit_amount]`);
  // Money stays in whole cents, so a fractional unit_amount_decimal is refused.
  const unitAmount = integer(rawAmount ?? rawDecimal ?? "", `${pdp}[unit_amount${rawAmount ? "" : "_decimal"}]`, 0);
  const quantity = optString(value, "quantity", `${p}[quantity]`);
  if (quantity === undefined) throw missingParam(`${p}[quantity]`);
  return {
    id: randomId("li_test_"),
    name: reqString(prod, "name", `${pdp}[product_data][name]`),
    description: optString(prod, "description", `${pdp}[product_data][description]`) ?? null,
    unitAmount,
    quantity: integer(quantity, `${p}[quantity]`, 1),
    currency: currency(reqString(pd, "currency", `${pdp}[currency]`), `${pdp}[currency]`),
    metadata: metadata(value.metadata, `${p}[metadata]`),
  };
}

function expand(value: FormValue | undefined): string[] {
  if (value === undefined) return [];
  if (!Array.isArray(value) || !value.every((v): v is string => typeof v === "string")) {
    throw invalidParam("expand", "Invalid array: expand must be a list of strings");
  }
  return value;
}

export function parseExpand(params: FormObject): string[] {
  return expand(params.expand);
}

export function parseCreateSession(params: FormObject): CreateSessionParams {
  onlyKeys(params, [...TOP_LEVEL], (k) => k);
  const mode = reqString(params, "mode", "mode");
  if (mode !== "payment") {
    throw invalidParam("mode", `Invalid mode: ${mode}. This local fake supports mode=payment only.`);
  }
  const ui = optString(params, "ui_mode", "ui_mode");
  if (ui !== undefined && ui !== "hosted_page") {
    throw invalidParam("ui_mode", `Invalid ui_mode: ${ui}. This local fake serves a hosted page only.`);
  }
  const pmt = params.payment_method_types;
  if (pmt !== undefined && !(Array.isArray(pmt) && pmt.every((t) => t === "card"))) {
    throw invalidParam("payment_method_types", "This local fake supports card only.");
  }
  const raw = params.line_items;
  if (raw === undefined) throw missingParam("line_items");
  if (!Array.isArray(raw) || raw.length === 0) throw invalidParam("line_items", "Invalid array: line_items");
  if (raw.length > 100) throw invalidParam("line_items", "line_items can have at most 100 items in payment mode.");
  const lineItems = raw.map(lineItem);
  const top = params.currency === undefined ? undefined : currency(reqString(params, "currency", "currency"), "currency");
  const cur = top ?? lineItems[0]?.currency ?? "usd";
  lineItems.forEach((li, i) => {
    if (li.currency !== cur) {
      throw invalidParam(`line_items[${i}][price_data][currency]`, "All line items must use the same currency.");
    }
  });
  const total = lineItems.reduce((sum, li) => sum + li.unitAmount * li.quantity, 0);
  // Minimum charge of 50 cents for USD and an 8-digit ceiling (from memory).
  if (cur === "usd" && total < 50) {
    throw invalidParam("line_items", "The Checkout Session's total amount due must add up to at least $0.50 usd", "amount_too_small");
  }
  if (total > 99_999_999) throw invalidParam("line_items", "Amount must be no more than 99,999,999 cents.", "amount_too_large");
  const now = nowSeconds();
  const rawExpires = optString(params, "expires_at", "expires_at");
  const expiresAt = rawExpires === undefined ? now + DAY : integer(rawExpires, "expires_at", 0);
  if (expiresAt < now + 30 * 60 || expiresAt > now + DAY) {
    throw invalidParam("expires_at", "expires_at must be between 30 minutes and 24 hours after the session is created.");
  }
  const pid = params.payment_intent_data;
  if (pid !== undefined && !isObject(pid)) throw invalidParam("payment_intent_data", "Invalid object: payment_intent_data");
  if (pid) onlyKeys(pid, ["metadata", "description"], (k) => `payment_intent_data[${k}]`);
  const clientReferenceId = optString(params, "client_reference_id", "client_reference_id") || null;
  if (clientReferenceId && clientReferenceId.length > 200) {
    throw invalidParam("client_reference_id", "client_reference_id can be at most 200 characters.");
  }
  return {
    lineItems,
    currency: cur,
    successUrl: url(params, "success_url", true) ?? "",
    cancelUrl: url(params, "cancel_url", false),
    clientReferenceId,
    customerEmail: email(optString(params, "customer_email", "customer_email")),
    metadata: metadata(params.metadata, "metadata"),
    expiresAt,
    paymentIntentData: {
      metadata: metadata(pid?.metadata, "payment_intent_data[metadata]"),
      description: (pid && optString(pid, "description", "payment_intent_data[description]")) || null,
    },
    expand: expand(params.expand),
  };
}
