import { SignInRedirect } from "@/components/auth/sign-in-redirect";

export default function Unauthorized() {
  return <SignInRedirect />;
}
