import { ButtonLink } from "@/components/ui/button";

export default function NotFound() {
  return (
    <main className="mx-auto flex max-w-md flex-col gap-4 px-5 py-16">
      <h1 className="text-2xl font-bold">Not found</h1>
      <p className="text-ink-soft">There is nothing here, or it belongs to another account.</p>
      <ButtonLink href="/" variant="secondary">
        Go to your home page
      </ButtonLink>
    </main>
  );
}
