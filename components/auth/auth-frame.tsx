import { CotterMark } from "@/components/shell/app-shell";

/** The frame of every page for people not signed in: the mark, a line of what Cotter is, one card. */
export function AuthFrame({ title, intro, children }: { title: string; intro?: React.ReactNode; children: React.ReactNode }) {
  return (
    <main className="mx-auto grid min-h-dvh max-w-4xl items-center gap-8 px-5 py-10 md:grid-cols-2">
      <div>
        <div className="mb-4 flex items-center gap-3">
          <CotterMark size={44} />
          <span className="text-4xl font-bold tracking-tight">Cotter</span>
        </div>
        <div className="text-lg text-ink-soft">
          {intro ?? "Where the shop and the fleet agree on the work: live unit status, what the technician found, and an estimate you decide line by line."}
        </div>
      </div>
      <div className="rounded-card border border-rule bg-paper-card p-6 shadow-[0_2px_0_#d8cdb9]">
        <h1 className="mb-4 text-2xl font-bold">{title}</h1>
        {children}
      </div>
    </main>
  );
}
