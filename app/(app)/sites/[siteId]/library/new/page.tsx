import type { Metadata } from "next";
import { Forbidden } from "@/components/forbidden";
import { loadSitePage } from "@/lib/auth/site-page";
import { MemberTypeForm } from "../member-type-form";

export const metadata: Metadata = { title: "New member type" };

export default async function NewMemberTypePage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("manageLibrary")) return <Forbidden what="The member library is kept by temporary works designers and organisation admins." />;
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <h1 className="text-2xl font-bold">New member type</h1>
      <MemberTypeForm siteId={site.id} />
    </div>
  );
}
