import type { Metadata } from "next";
import { LibraryWorkspace } from "@/components/library/library-workspace";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";

export const metadata: Metadata = { title: "Equipment library" };

export default async function LibraryPage() {
  const { ctx, allowed } = await pageContext("library:read");
  if (!allowed) return <Refusal message="The equipment library is open to designers, reviewers, the permit office and administrators." />;
  return (
    <>
      <PageHeader title="Equipment library" sheet="The organisation's equipment, with the ratings the checks read" />
      <p className="mb-4 max-w-3xl text-sm text-ink-soft">
        Enter ratings from the manufacturer&apos;s current datasheet and nameplate. The checks read them as entered; the licensed reviewer and
        the AHJ decide.
      </p>
      <LibraryWorkspace canEdit={can(ctx.roles, "library:edit")} />
    </>
  );
}
