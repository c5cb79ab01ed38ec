/**
 * Decodes the SDK's form encoding (esm/utils.js `stringifyRequestData`):
 * `metadata[invoiceId]=x`, `line_items[0][price_data][unit_amount]=100`,
 * `expand[0]=payment_intent`; `expand[]=...` is accepted too.
 */
export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

export class FormShapeError extends Error {
  constructor(readonly param: string) {
    super(`Invalid shape for parameter ${param}`);
  }
}

function splitKey(key: string): string[] | null {
  const first = key.indexOf("[");
  if (first === -1) return [key];
  const parts = [key.slice(0, first)];
  const rest = key.slice(first);
  const re = /\[([^\]]*)\]/gy;
  let match: RegExpExecArray | null;
  let consumed = 0;
  while ((match = re.exec(rest)) !== null) {
    parts.push(match[1] ?? "");
    consumed = re.lastIndex;
  }
  return consumed === rest.length && parts[0] !== "" ? parts : null;
}

function isObject(v: FormValue | undefined): v is FormObject {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

export function parseForm(text: string): FormObject {
  const root: FormObject = {};
  for (const [key, value] of new URLSearchParams(text)) {
    const parts = splitKey(key);
    if (!parts) throw new FormShapeError(key);
    let node: FormObject = root;
    for (let i = 0; i < parts.length; i++) {
      const part = parts[i] ?? "";
      const last = i === parts.length - 1;
      const name = part === "" ? String(Object.keys(node).length) : part;
      if (last) {
        if (node[name] !== undefined) throw new FormShapeError(key);
        node[name] = value;
        break;
      }
      const next = node[name];
      if (next === undefined) {
        const created: FormObject = {};
        node[name] = created;
        node = created;
      } else if (isObject(next)) {
        node = next;
      } else {
        throw new FormShapeError(key);
      }
    }
  }
  return arraysFromIndexes(root) as FormObject;
}

/** Objects whose keys are exactly 0..n-1 become arrays, as the API reads them. */
function arraysFromIndexes(value: FormValue): FormValue {
  if (!isObject(value)) return value;
  const keys = Object.keys(value);
  const converted: FormObject = {};
  for (const k of keys) converted[k] = arraysFromIndexes(value[k] ?? "");
  const indexed = keys.length > 0 && keys.every((k) => /^\d+$/.test(k));
  if (!indexed) return converted;
  const sorted = keys.map(Number).sort((a, b) => a - b);
  if (!sorted.every((n, i) => n === i)) return converted;
  return sorted.map((n) => converted[String(n)] ?? "");
}
