"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";

/** A command to copy: shown in full (it works by selecting it too), with a button that copies it. */
export function CopyCommand({ label, command }: { label: string; command: string }) {
  const [copied, setCopied] = useState(false);
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="text-sm font-semibold">{label}</figcaption>
      {/* Wrapped rather than scrolled, so no region needs a tab stop of its own. */}
      <pre className="rounded bg-white p-3 text-sm break-all whitespace-pre-wrap" data-testid="copy-command">
        <code>{command}</code>
      </pre>
      <div className="flex items-center gap-3">
        <Button
          type="button"
          variant="secondary"
          onClick={() => {
            void navigator.clipboard.writeText(command).then(
              () => setCopied(true),
              // No clipboard (an insecure origin, a refusal): the command stays there to select.
              () => setCopied(false),
            );
          }}
        >
          Copy
        </Button>
        <span role="status" className="text-sm text-ink-soft">
          {copied ? "Copied." : ""}
        </span>
      </div>
    </figure>
  );
}
