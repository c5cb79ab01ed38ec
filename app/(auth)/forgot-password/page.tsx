import type { Metadata } from "next";
import Link from "next/link";
import { AuthFrame } from "@/components/auth/auth-frame";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password?" };

export default function ForgotPasswordPage() {
  return (
    <AuthFrame title="Forgot your password?">
      <p className="mb-4">Enter the e-mail you sign in with and we will send a link to choose a new password.</p>
      <ForgotPasswordForm />
      <p className="mt-4">
        <Link href="/sign-in">Back to sign in</Link>
      </p>
    </AuthFrame>
  );
}
