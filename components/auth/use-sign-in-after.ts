"use client";

import { useEffect, useRef, useState, type FormEvent } from "react";
import type { ActionResult } from "@/lib/server/auth/guarded-action";
import { signInWith } from "./sign-in-after";

/**
 * For forms that set a password: once the action succeeds, sign in with the
 * password typed, then run `then`. React empties the form after its action
 * has run, so the password is kept at submit (`onSubmit`), never sent back.
 */
export function useSignInAfter(state: ActionResult<{ email: string }> | null, field: string, then: (signedIn: boolean) => void) {
  const typed = useRef("");
  // Signing in from the moment the action succeeds until the sign-in answers for that success.
  const [settled, setSettled] = useState<unknown>(null);
  const thenRef = useRef(then);
  useEffect(() => {
    thenRef.current = then;
  });
  useEffect(() => {
    if (!state?.ok) return;
    void signInWith(state.data.email, typed.current).then((ok) => {
      setSettled(state);
      thenRef.current(ok);
    });
  }, [state]);
  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    typed.current = String(new FormData(e.currentTarget).get(field) ?? "");
  };
  return { signing: Boolean(state?.ok) && settled !== state, onSubmit };
}
