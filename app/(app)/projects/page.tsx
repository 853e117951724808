import type { Metadata } from "next";
import { ProjectsTable } from "@/components/projects/projects-table";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { pageContext } from "@/lib/auth/page-context";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage() {
  const { allowed } = await pageContext("project:read");
  return (
    <>
      <PageHeader title="Projects" sheet="Designs in this organisation" />
      {allowed ? <ProjectsTable /> : <Refusal message="Projects are open to designers, reviewers and the permit office." />}
    </>
  );
}
