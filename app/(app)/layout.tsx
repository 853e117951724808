import { redirect } from "next/navigation";
import { AppShell } from "@/components/shell/app-shell";
import { QueryProvider } from "@/components/ui/query-provider";
import { currentContext } from "@/lib/auth/session";
import { currentOrganisation } from "@/lib/services/organisations";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const ctx = await currentContext();
  if (!ctx) redirect("/sign-in");
  const org = currentOrganisation(ctx);
  return (
    <AppShell user={ctx.user} orgName={org?.name ?? ""} roles={ctx.roles}>
      <QueryProvider>{children}</QueryProvider>
    </AppShell>
  );
}
