import { ButtonLink } from "@/components/ui/button";
import { CotterMark } from "./app-shell";

/** Shown instead of a page the caller's role may not open: says so plainly and points home, and shows nothing of the page. */
export function TurnedAway({ name, home, staff }: { name: string | null; home: string; staff: boolean }) {
  return (
    <main className="mx-auto flex max-w-md flex-col gap-4 px-5 py-12" data-testid="turned-away">
      <CotterMark size={40} />
      <h1 className="text-2xl font-bold">{staff ? "Your role does not open this page" : "This page is for shop staff"}</h1>
      <p className="text-ink-soft">
        {name ? `You are signed in as ${name}. ` : ""}
        {staff ? "Ask the shop's owner if you need it." : "Your fleet's units, approvals and invoices are on your own home page."}
      </p>
      <ButtonLink href={home}>{staff ? "Go to the Floor" : "Go to your fleet home"}</ButtonLink>
    </main>
  );
}
