import type { Metadata } from "next";
import Link from "next/link";
import { AuthSheet } from "@/components/account/auth-sheet";
import { ResetRequestForm } from "@/components/account/reset-request-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <AuthSheet title="Forgot your password?" sheet="G-001">
      <p className="mb-4 text-sm text-ink-soft">Enter the e-mail you sign in with. We send a link to choose a new password; it works once, within an hour.</p>
      <ResetRequestForm />
      <p className="mt-4 text-sm">
        <Link href="/sign-in" className="underline">
          Back to sign in
        </Link>
      </p>
    </AuthSheet>
  );
}
