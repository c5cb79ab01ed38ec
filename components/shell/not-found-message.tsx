import { ButtonLink } from "@/components/ui/button";

/**
 * What a missing record looks like in every part of the app. Another account's
 * record reads exactly like one that never existed, so the text never says which.
 */
export function NotFoundMessage({ home, homeLabel, hint, inShell = false }: { home: string; homeLabel: string; hint: string; inShell?: boolean }) {
  // Inside the app's frame the page already has its one <main>.
  const Frame = inShell ? "div" : "main";
  return (
    <Frame className="mx-auto flex max-w-md flex-col gap-4 px-5 py-16">
      <h1 className="text-2xl font-bold">Not found</h1>
      <p className="text-ink-soft">{hint}</p>
      <ButtonLink href={home} variant="secondary">
        {homeLabel}
      </ButtonLink>
    </Frame>
  );
}
