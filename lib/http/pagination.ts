import { z } from "zod";

/** The API's page size (api-v1.md): pages in the UI show as many rows. */
export const PAGE_SIZE = 50;

/** ?limit= (default 50, max 200) and ?cursor= as api-v1.md fixes them. */
export const pageQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(PAGE_SIZE),
  cursor: z.string().max(500).optional(),
});

export type PageQuery = z.output<typeof pageQuery>;

/** Cursors are opaque to callers: base64url JSON of the last row's sort key. */
export function encodeCursor(key: readonly (string | number)[]): string {
  return Buffer.from(JSON.stringify(key)).toString("base64url");
}

export function decodeCursor(cursor: string | undefined, arity: number): (string | number)[] | null {
  if (!cursor) return null;
  try {
    const value: unknown = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
    if (Array.isArray(value) && value.length === arity && value.every((v) => typeof v === "string" || typeof v === "number")) {
      return value;
    }
  } catch {
    // fall through
  }
  return null;
}

/** Takes limit+1 rows, returns the page and the cursor of its last row (null at the end). */
export function paginate<T>(rows: T[], limit: number, keyOf: (row: T) => readonly (string | number)[]) {
  const page = rows.slice(0, limit);
  const last = page.at(-1);
  return { page, nextCursor: rows.length > limit && last ? encodeCursor(keyOf(last)) : null };
}
