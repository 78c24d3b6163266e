import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CautionNotice } from "@/components/caution-notice";
import { Forbidden } from "@/components/forbidden";
import { countMembersOfType, getMemberType } from "@/db/queries/member-types";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { MemberTypeForm } from "../member-type-form";

export const metadata: Metadata = { title: "Member type" };

export default async function MemberTypePage({ params }: { params: Promise<{ siteId: string; typeId: string }> }) {
  const { siteId, typeId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("manageLibrary")) return <Forbidden what="The member library is kept by temporary works designers and organisation admins." />;
  if (!isUuid(typeId)) notFound();
  const type = await getMemberType({ organisationId: site.organisationId, memberTypeId: typeId });
  if (!type) notFound();
  const used = await countMembersOfType({ memberTypeId: type.id });
  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-4">
      <h1 className="text-2xl font-bold">{type.name}</h1>
      <p className="text-ink-soft">
        Revision {type.revision} · used by {used} member{used === 1 ? "" : "s"}. Saving a change re-checks every one of them.
      </p>
      <MemberTypeForm
        siteId={site.id}
        existing={{ id: type.id, name: type.name, kind: type.kind, supplier: type.supplier, notes: type.notes, params: type.params, minExtensionMm: type.minExtensionMm, maxExtensionMm: type.maxExtensionMm }}
        usedBy={used}
      />
      <CautionNotice compact />
    </div>
  );
}
