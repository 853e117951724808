import type { Metadata } from "next";
import { PacketPanel } from "@/components/packet/packet-panel";
import { Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";
import { can } from "@/lib/auth/permissions";

export const metadata: Metadata = { title: "Packet" };

export default async function ProjectPacketPage({ params }: { params: Promise<{ id: string }> }) {
  const { ctx, allowed } = await pageContext("packet:read");
  if (!allowed) return <Refusal message="Permit packets are open to designers, reviewers, the permit office and installers." />;
  const { id } = await params;
  return <PacketPanel projectId={id} canGenerate={can(ctx.roles, "packet:generate")} canDecide={can(ctx.roles, "review:decide")} />;
}
