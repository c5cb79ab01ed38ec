import Link from "next/link";

const WORDS = {
  used: "This link has already been used. Sign in with the password you chose.",
  expired: "This link has expired.",
  withdrawn: "This invitation was withdrawn.",
  invalid: "This link is not valid. If you were sent a newer one, use that.",
} as const;

/** What an e-mailed link says when it no longer opens anything, and where to go instead. */
export function LinkRefusal({ state, next }: { state: keyof typeof WORDS; next: string }) {
  return (
    <div className="flex flex-col gap-3" data-testid="link-refusal">
      <p role="alert" className="rounded-card border-2 border-rust bg-rust-wash px-3 py-2 font-semibold text-rust-deep">
        {WORDS[state]}
      </p>
      <p>{next}</p>
      <p className="flex gap-4">
        <Link href="/sign-in">Sign in</Link>
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
    </div>
  );
}
