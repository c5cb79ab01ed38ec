export function GroupLoading() {
  return (
    <div aria-busy="true" aria-live="polite" className="animate-pulse">
      <div className="mb-5 h-10 w-1/3 rounded-card bg-paper-deep" />
      <div className="grid gap-3 sm:grid-cols-2">
        <div className="h-32 rounded-card bg-paper-deep" />
        <div className="h-32 rounded-card bg-paper-deep" />
      </div>
      <span className="sr-only">Loading…</span>
    </div>
  );
}
