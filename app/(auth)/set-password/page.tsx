import type { Metadata } from "next";
import Link from "next/link";
import { AuthSheet } from "@/components/account/auth-sheet";
import { SetPasswordForm } from "@/components/account/set-password-form";
import { DEAD_LINK, describeAccountLink } from "@/lib/services/users/account-links";

export const metadata: Metadata = { title: "Choose a password" };

export default async function SetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const link = describeAccountLink(token);
  if (!link || !token) {
    return (
      <AuthSheet title="This link no longer works" sheet="G-002">
        <p role="alert" className="border-l-4 border-signal bg-signal-soft px-3 py-2 text-sm text-ink">
          {DEAD_LINK}
        </p>
        <p className="mt-4 text-sm">
          <Link href="/forgot-password" className="underline">
            Ask for a new reset link
          </Link>
        </p>
      </AuthSheet>
    );
  }
  return (
    <AuthSheet title={link.purpose === "invite" ? "Welcome: choose your password" : "Choose a new password"} sheet="G-002">
      <p className="mb-4 text-sm text-ink-soft">
        For <span className="font-medium text-ink">{link.name}</span> ({link.email}).
      </p>
      <SetPasswordForm token={token} />
    </AuthSheet>
  );
}
