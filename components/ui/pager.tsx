import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

/** ?page= as the pager writes it: which page of the list this is (1 without a cursor). */
export function pageNumber(cursor: string | undefined, page: string | undefined): number {
  const n = Number(page);
  return cursor && Number.isInteger(n) && n > 1 && n < 100_000 ? n : 1;
}

/**
 * "First page" and "Next page" links for a cursor-paged list, keeping the page's
 * other query parameters. Plain links: they work without JavaScript. The page
 * the reader is on is named, so a screen reader hears where they are.
 */
export function Pager({
  base,
  params,
  nextCursor,
  label = "Pages",
  hash = "",
}: {
  base: string;
  params: Record<string, string | undefined>;
  nextCursor: string | null;
  label?: string;
  /** A fragment to land on (the list's heading), for lists lower on a page. */
  hash?: string;
}) {
  const page = pageNumber(params.cursor, params.page);
  const query = (extra: Record<string, string | undefined>) => {
    const q = new URLSearchParams();
    for (const [k, v] of Object.entries({ ...params, ...extra })) if (v) q.set(k, v);
    const s = q.toString();
    return `${s ? `${base}?${s}` : base}${hash}`;
  };
  if (!nextCursor && !params.cursor) return null;
  return (
    <nav aria-label={label} className="mt-3 flex flex-wrap items-center gap-3">
      {params.cursor ? (
        <Link href={query({ cursor: undefined, page: undefined })} className={buttonClass("secondary", "no-underline")}>
          First page
        </Link>
      ) : null}
      <span aria-current="page" className="figures text-sm text-ink-soft">
        Page {page}
      </span>
      {nextCursor ? (
        <Link href={query({ cursor: nextCursor, page: String(page + 1) })} className={buttonClass("secondary", "no-underline")} rel="next">
          Next page
        </Link>
      ) : null}
    </nav>
  );
}
