import { READING_KINDS, type FieldSpec, type ReadingKind } from "@/lib/specs";

/** A reading as the form holds it: the kind, where, and each field as typed (text). */
export interface ReadingDraft {
  key: string;
  kind: ReadingKind;
  location: string;
  values: Record<string, string>;
}

export function todayIso(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;
}

export function fieldsOf(kind: ReadingKind): readonly FieldSpec[] {
  return READING_KINDS[kind].fields as readonly FieldSpec[];
}

export function newReadingDraft(kind: ReadingKind): ReadingDraft {
  const values: Record<string, string> = {};
  for (const f of fieldsOf(kind)) {
    if (f.type === "select") values[f.name] = String(f.options[0]?.value ?? "");
    else if (f.type === "date" && f.defaultToday) values[f.name] = todayIso();
    else values[f.name] = "";
  }
  return { key: `${kind}-${Date.now()}-${Math.random().toString(36).slice(2, 6)}`, kind, location: "", values };
}

/**
 * The typed input the server expects ({ kind, location, …fields }). Empty
 * optional fields are left out; text that is not a number is sent as typed,
 * so the server names the field in its answer.
 */
export function draftToInput(draft: ReadingDraft): Record<string, unknown> {
  const out: Record<string, unknown> = { kind: draft.kind, location: draft.location.trim() };
  for (const f of fieldsOf(draft.kind)) {
    const raw = (draft.values[f.name] ?? "").trim();
    if (raw === "") continue;
    if (f.type === "number") {
      const n = Number(raw.replace(",", "."));
      out[f.name] = Number.isFinite(n) ? n : raw;
    } else if (f.type === "select") {
      out[f.name] = f.options.find((o) => String(o.value) === raw)?.value ?? raw;
    } else {
      out[f.name] = raw;
    }
  }
  return out;
}
