export function PageHeader({
  title,
  kicker,
  children,
}: {
  title: React.ReactNode;
  kicker?: React.ReactNode;
  children?: React.ReactNode;
}) {
  return (
    <header className="mb-5 flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-3">
      <div>
        {kicker ? <p className="text-sm font-semibold tracking-wide text-ink-faint uppercase">{kicker}</p> : null}
        <h1 className="text-2xl leading-tight font-bold sm:text-3xl">{title}</h1>
      </div>
      {children ? <div className="flex flex-wrap gap-2">{children}</div> : null}
    </header>
  );
}
