import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/forbidden";
import { getRegisterFilterOptions } from "@/db/queries/member-list";
import { loadSitePage } from "@/lib/auth/site-page";
import { IMPORT_COLUMNS } from "@/lib/register/members-csv";
import { MAX_IMPORT_ROWS } from "@/lib/register/import-members";
import { ImportForm } from "./import-form";

export const metadata: Metadata = { title: "Import members" };

export default async function ImportMembersPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  const back = (
    <Link href={`/sites/${site.id}/members`} className="font-semibold text-brand underline-offset-4 hover:underline">
      ← Register
    </Link>
  );
  if (!may("importMembers"))
    return (
      <div className="flex flex-col gap-4">
        {back}
        <h1 className="text-2xl font-bold">Import members</h1>
        <Forbidden what="Importing members is for site engineers and the temporary works coordinator." />
      </div>
    );
  const o = await getRegisterFilterOptions({ siteId: site.id, organisationId: site.organisationId });
  return (
    <div className="flex max-w-3xl flex-col gap-4">
      {back}
      <div>
        <h1 className="text-2xl font-bold">Import members</h1>
        <p className="text-ink-soft">{site.name}</p>
      </div>
      <section className="flex flex-col gap-2 rounded-xl border-2 border-ink/10 bg-paper-raised p-4">
        <h2 className="text-lg font-bold">How it works</h2>
        <ul className="list-disc space-y-1 pl-5">
          <li>
            One member per row, up to {MAX_IMPORT_ROWS.toLocaleString("en-GB")} rows. Columns:{" "}
            <code className="text-sm">{IMPORT_COLUMNS.join(", ")}</code>.
          </li>
          <li>
            Lengths in millimetres; the load in kN (<code>load_kn</code>) or in N (<code>load_n</code>), or leave it empty and give both
            spacings to derive it from the scheme&apos;s slab.
          </li>
          <li>Zones, schemes and types are named as on this site (below). Every member is checked, as when logged on a phone, and kept as a draft.</li>
          <li>
            <strong>All or nothing:</strong> if any row has a problem, nothing is imported and you get a list of every problem by row and column.
          </li>
        </ul>
        <p>
          <a className="font-semibold text-brand underline" href={`/api/v1/sites/${site.id}/members/import`} download>
            Download the template (CSV)
          </a>
        </p>
        <details>
          <summary className="min-h-touch cursor-pointer py-2 font-semibold">Names this site uses</summary>
          <div className="grid gap-3 sm:grid-cols-3">
            <div>
              <h3 className="font-semibold">Zones</h3>
              <ul className="text-sm">{o.zones.map((z) => <li key={z.id}>{z.name}</li>)}</ul>
            </div>
            <div>
              <h3 className="font-semibold">Schemes</h3>
              <ul className="text-sm">{o.schemes.map((s) => <li key={s.id}>{s.reference}</li>)}</ul>
            </div>
            <div>
              <h3 className="font-semibold">Member types</h3>
              <ul className="text-sm">{o.types.map((t) => <li key={t.id}>{t.name}</li>)}</ul>
            </div>
          </div>
        </details>
      </section>
      <ImportForm siteId={site.id} />
    </div>
  );
}
