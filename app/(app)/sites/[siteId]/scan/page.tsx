import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { getMemberIdByTag } from "@/db/queries/members";
import { loadSitePage } from "@/lib/auth/site-page";
import { env } from "@/lib/env";
import { tagSchema } from "@/lib/validations/member";
import { Scanner } from "./scanner";

export const metadata: Metadata = { title: "Scan a label" };

/**
 * The label scanner. With `?tag=` (a tag read from a label, or typed): the member with that tag on
 * this site, or the log form with the tag filled in; someone who may not log members is told there
 * is no such member.
 */
export default async function ScanPage({ params, searchParams }: { params: Promise<{ siteId: string }>; searchParams: Promise<{ tag?: string | string[] }> }) {
  const { siteId } = await params;
  const { tag: rawTag } = await searchParams;
  const { site, may } = await loadSitePage(siteId);
  let notice: string | null = null;
  if (typeof rawTag === "string") {
    const tag = tagSchema.safeParse(rawTag);
    if (!tag.success) notice = `"${rawTag.slice(0, 60)}" is not a member tag: ${tag.error.issues[0]?.message ?? "check it against the label."}`;
    else {
      const memberId = await getMemberIdByTag({ siteId: site.id, tag: tag.data });
      if (memberId) redirect(`/sites/${site.id}/members/${memberId}`);
      if (may("logMember")) redirect(`/sites/${site.id}/members/new?tag=${encodeURIComponent(tag.data)}`);
      notice = `No member tagged ${tag.data} is on ${site.name}. Check the tag against the label, or ask a site engineer to log it.`;
    }
  }
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-4">
      <h1 className="text-2xl font-bold">Scan a label</h1>
      {/* Keyed on the tag, so a new answer from the server (a tag not on the site) is shown. */}
      <Scanner key={typeof rawTag === "string" ? rawTag : ""} siteId={site.id} appOrigin={new URL(env.APP_URL).origin} notice={notice} initialTag={typeof rawTag === "string" ? rawTag.slice(0, 60) : ""} />
    </div>
  );
}
