import { ButtonLink } from "@/components/ui/button";
import { CotterMark } from "./app-shell";

/** Shown instead of a shop page to a fleet user: says so plainly and points home. */
export function TurnedAway({ name, home }: { name: string | null; home: string }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-4 px-5" data-testid="turned-away">
      <CotterMark size={40} />
      <h1 className="text-2xl font-bold">This page is for shop staff</h1>
      <p className="text-ink-soft">
        {name ? `You are signed in as ${name}. ` : ""}Your fleet&apos;s units, approvals and invoices are on your own home page.
      </p>
      <ButtonLink href={home}>Go to your fleet home</ButtonLink>
    </main>
  );
}
