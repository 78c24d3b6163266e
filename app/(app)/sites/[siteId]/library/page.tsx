import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { ButtonLink } from "@/components/ui/button";
import { listMemberTypes } from "@/db/queries/member-types";
import { loadSitePage } from "@/lib/auth/site-page";
import { formatLength } from "@/lib/units";
import { MEMBER_TYPE_KIND_LABELS, MEMBER_TYPE_KINDS } from "@/lib/validations/member-type";

export const metadata: Metadata = { title: "Member library" };

export default async function LibraryPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("manageLibrary")) return <Forbidden what="The member library is kept by temporary works designers and organisation admins." />;
  const types = await listMemberTypes({ organisationId: site.organisationId });
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div>
          <h1 className="text-2xl font-bold">Member library</h1>
          <p className="text-ink-soft">Your organisation&apos;s props, struts and sections, shared by every site.</p>
        </div>
        <ButtonLink href={`/sites/${site.id}/library/new`}>
          <Icon name="add" /> New member type
        </ButtonLink>
      </div>
      {MEMBER_TYPE_KINDS.map((kind) => {
        const rows = types.filter((t) => t.kind === kind);
        if (rows.length === 0) return null;
        return (
          <section key={kind} aria-labelledby={`kind-${kind}`}>
            <h2 id={`kind-${kind}`} className="mb-2 text-lg font-bold">{MEMBER_TYPE_KIND_LABELS[kind]}</h2>
            <ul className="flex flex-col gap-2">
              {rows.map((t) => (
                <li key={t.id}>
                  <Link href={`/sites/${site.id}/library/${t.id}`} className="flex min-h-touch flex-wrap items-center justify-between gap-2 rounded-xl border-2 border-ink/15 bg-paper-raised p-3 hover:border-brand">
                    <span>
                      <span className="block font-semibold">{t.name}</span>
                      <span className="text-sm text-ink-soft">
                        {t.supplier ?? "—"}
                        {t.minExtensionMm != null && t.maxExtensionMm != null ? ` · ${formatLength(t.minExtensionMm)} to ${formatLength(t.maxExtensionMm)}` : ""} · revision {t.revision}
                      </span>
                    </span>
                    <span className="tabular text-sm font-semibold">{t.memberCount} member{t.memberCount === 1 ? "" : "s"}</span>
                  </Link>
                </li>
              ))}
            </ul>
          </section>
        );
      })}
    </div>
  );
}
