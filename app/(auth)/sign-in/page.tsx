import type { Metadata } from "next";
import { redirect } from "next/navigation";
import Link from "next/link";
import { AuthSheet } from "@/components/account/auth-sheet";
import { currentContext } from "@/lib/auth/session";
import { homeFor } from "@/lib/auth/roles";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const ctx = await currentContext();
  if (ctx) redirect(homeFor(ctx.roles));
  const { callbackUrl } = await searchParams;
  let next = "/";
  if (callbackUrl) {
    try {
      const url = new URL(callbackUrl, "http://localhost");
      next = url.pathname + url.search;
    } catch {
      next = "/";
    }
  }
  return (
    <AuthSheet title="Sign in" sheet="G-000">
      <SignInForm next={next} />
      <p className="mt-4 text-sm">
        <Link href="/forgot-password" className="underline">
          Forgot your password?
        </Link>
      </p>
    </AuthSheet>
  );
}
