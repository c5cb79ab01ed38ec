/** The end of a list drawn a page at a time: how much is drawn, and a button for the next page. Nothing once all is drawn. */
export function ShowMore({ drawn, total, noun, pageSize, note, onMore, testId }: { drawn: number; total: number; noun: string; pageSize: number; note?: string; onMore: () => void; testId?: string }) {
  if (drawn >= total) return null;
  return (
    <div className="flex flex-col items-start gap-2" data-testid={testId}>
      <p className="text-sm text-ink-soft">
        Showing {drawn} of {total} {noun}.{note ? ` ${note}` : ""}
      </p>
      <button type="button" className="rounded-card border-2 border-ink bg-white px-4 py-2 font-semibold" onClick={onMore}>
        Show the next {Math.min(pageSize, total - drawn)} {noun}
      </button>
    </div>
  );
}
