import { formatCents } from "@/lib/money";
import type { SessionRecord } from "./types";

/** Our own plain look: warm paper, graphite text, one rust-orange accent. No scripts. */
const STYLE = `
:root { --paper: #f6f0e4; --card: #fffaf1; --ink: #2d2f33; --muted: #5b5d62; --rust: #a9461a; --line: #d8ccb8; }
* { box-sizing: border-box; }
body { margin: 0; background: var(--paper); color: var(--ink); font: 1.0625rem/1.5 system-ui, sans-serif; }
main { max-width: 30rem; margin: 0 auto; padding: 1.5rem 1rem 3rem; }
.banner { border: 2px dashed var(--rust); padding: .75rem 1rem; margin: 0 0 1.5rem; background: var(--card); }
h1 { font-size: 1.5rem; margin: 0 0 .25rem; }
.total { font-size: 2rem; font-weight: 700; margin: 0 0 1rem; }
ul.items { list-style: none; padding: 0; margin: 0 0 1.5rem; border-top: 1px solid var(--line); }
ul.items li { display: flex; justify-content: space-between; gap: 1rem; padding: .5rem 0; border-bottom: 1px solid var(--line); }
form { background: var(--card); border: 1px solid var(--line); padding: 1rem; }
label { display: block; font-weight: 600; margin-top: .75rem; }
.row { display: flex; gap: 1rem; } .row > div { flex: 1; }
input { width: 100%; font: inherit; padding: .5rem .625rem; border: 1px solid var(--muted); border-radius: 4px; background: #fff; color: var(--ink); }
input[aria-invalid="true"] { border: 2px solid var(--rust); }
:focus-visible { outline: 3px solid var(--rust); outline-offset: 2px; }
.hint { color: var(--muted); font-size: .9375rem; margin: .25rem 0 0; }
.field-error { color: var(--rust); font-weight: 600; margin: .25rem 0 0; }
.alert { border-left: 4px solid var(--rust); background: #fbe9df; padding: .75rem 1rem; margin: 0 0 1rem; font-weight: 600; }
button { margin-top: 1.25rem; width: 100%; font: inherit; font-weight: 700; padding: .75rem; border: 0; border-radius: 4px; background: var(--rust); color: #fff; cursor: pointer; }
a { color: var(--rust); }
.back { display: inline-block; margin-top: 1.25rem; }
`;

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex"><title>${escapeHtml(title)}</title><style>${STYLE}</style></head>
<body><main>
<p class="banner" role="note"><strong>Local test payment page.</strong> This is Cotter's development stand-in for the card processor. No real card is charged and no money moves.</p>
${body}
</main></body></html>`;
}

export interface FormState {
  formError?: string;
  fieldErrors?: { card_number?: string; expiry?: string; cvc?: string };
  values?: { card_number?: string; expiry?: string };
}

const money = (record: SessionRecord, cents: number): string =>
  formatCents(cents, (record.session.currency ?? "usd").toUpperCase());

function field(name: "card_number" | "expiry" | "cvc", label: string, attrs: string, hint: string, state: FormState): string {
  const error = state.fieldErrors?.[name];
  const value = name === "cvc" ? "" : (state.values?.[name] ?? "");
  const describedBy = [`${name}-hint`, error ? `${name}-error` : ""].filter(Boolean).join(" ");
  return `<label for="${name}">${label}</label>
<input id="${name}" name="${name}" ${attrs} value="${escapeHtml(value)}" required aria-describedby="${describedBy}"${error ? ' aria-invalid="true"' : ""}>
<p class="hint" id="${name}-hint">${hint}</p>${error ? `<p class="field-error" id="${name}-error">${escapeHtml(error)}</p>` : ""}`;
}

export function paymentPage(record: SessionRecord, state: FormState = {}): string {
  const s = record.session;
  const total = money(record, s.amount_total ?? 0);
  const items = record.lineItems
    .map((li) => {
      const qty = li.quantity > 1 ? ` × ${li.quantity}` : "";
      return `<li><span>${escapeHtml(li.name)}${qty}</span><span>${money(record, li.unitAmount * li.quantity)}</span></li>`;
    })
    .join("");
  const alert = state.formError ? `<p class="alert" role="alert" id="form-error">${escapeHtml(state.formError)}</p>` : "";
  const back = s.cancel_url ? `<a class="back" href="${escapeHtml(s.cancel_url)}">Go back without paying</a>` : "";
  const body = `<h1>Pay by card</h1>
<p class="total">${total}</p>
<ul class="items" aria-label="What this payment covers">${items}</ul>
<form method="post" action="/pay/${escapeHtml(s.id)}" novalidate>
${alert}
${field("card_number", "Card number", 'inputmode="numeric" autocomplete="cc-number" spellcheck="false"', "Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.", state)}
<div class="row"><div>
${field("expiry", "Expiry (MM / YY)", 'inputmode="numeric" autocomplete="cc-exp" placeholder="MM / YY"', "Any future month.", state)}
</div><div>
${field("cvc", "Security code", 'inputmode="numeric" autocomplete="cc-csc" maxlength="4"', "Any 3 digits.", state)}
</div></div>
<button type="submit">Pay ${total}</button>
</form>
${back}`;
  return layout(`${state.formError ? "Error: " : ""}Pay ${total} (local test)`, body);
}

export function noticePage(title: string, message: string, link?: { href: string; text: string }): string {
  const a = link ? `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.text)}</a></p>` : "";
  return layout(`${title} (local test)`, `<h1>${escapeHtml(title)}</h1><p>${escapeHtml(message)}</p>${a}`);
}
