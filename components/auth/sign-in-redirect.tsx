"use client";

import { useEffect } from "react";

/** Sends the browser to sign in and brings it back to the page it asked for (e.g. an e-mailed link). */
export function SignInRedirect() {
  useEffect(() => {
    const next = `${window.location.pathname}${window.location.search}`;
    window.location.replace(`/sign-in?next=${encodeURIComponent(next)}`);
  }, []);
  return (
    <main className="mx-auto max-w-md px-5 py-16">
      <p>
        Sign in to see this page. <a href="/sign-in">Go to sign in</a>.
      </p>
    </main>
  );
}
