import { NotFoundMessage } from "@/components/shell/not-found-message";

// A set-up, invitation or reset link that was used, expired or mistyped ends here.
export default function AuthNotFound() {
  return <NotFoundMessage home="/sign-in" homeLabel="Go to sign-in" hint="This page is not open. A set-up, invitation or password-reset link works once and for a limited time; ask for a new one if you still need it." />;
}
