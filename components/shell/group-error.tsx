"use client";

import { Button } from "@/components/ui/button";

export function GroupError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="flex max-w-md flex-col gap-3 py-10" role="alert">
      <h1 className="text-2xl font-bold">This page could not load</h1>
      <p className="text-ink-soft">Nothing was changed. Try again; if it keeps happening, tell the shop.</p>
      <div>
        <Button onClick={reset}>Try again</Button>
      </div>
    </div>
  );
}
