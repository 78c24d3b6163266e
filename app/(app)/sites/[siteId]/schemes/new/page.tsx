import type { Metadata } from "next";
import { Forbidden } from "@/components/forbidden";
import { loadSitePage } from "@/lib/auth/site-page";
import { SchemeForm } from "../scheme-form";

export const metadata: Metadata = { title: "New scheme" };

export default async function NewSchemePage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { user, site, may, roles } = await loadSitePage(siteId);
  if (!may("manageSchemes")) return <Forbidden what="Schemes are published by temporary works designers and coordinators." />;
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <h1 className="text-2xl font-bold">New scheme</h1>
      <SchemeForm siteId={site.id} unitSystem={site.unitSystem} defaultDesigner={roles.includes("designer") ? user.name : ""} />
    </div>
  );
}
