export function EmptyState({ title, children }: { title: string; children?: React.ReactNode }) {
  return (
    <div className="rounded-card border-2 border-dashed border-rule-strong p-6 text-center text-ink-soft">
      <p className="font-semibold text-ink">{title}</p>
      {children ? <div className="mt-1 text-sm">{children}</div> : null}
    </div>
  );
}
