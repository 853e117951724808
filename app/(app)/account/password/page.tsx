import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { ChangePasswordForm } from "@/components/account/change-password-form";
import { PageHeader } from "@/components/ui/page-header";
import { currentContext } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Change password" };

export default async function ChangePasswordPage() {
  const ctx = await currentContext();
  if (!ctx) redirect("/sign-in");
  return (
    <>
      <PageHeader title="Change password" sheet={ctx.user.name} />
      {ctx.mustChangePassword ? (
        <p className="mb-4 max-w-prose border-l-4 border-signal bg-signal-soft px-3 py-2 text-sm text-ink">
          An administrator set the password you signed in with. Choose your own before you continue: type the one you were given as the current password.
        </p>
      ) : null}
      <p className="mb-5 max-w-prose text-sm leading-relaxed text-ink-soft">
        Changing your password signs you out everywhere, here included; sign in again with the new one.
      </p>
      <ChangePasswordForm />
    </>
  );
}
