import type { Metadata } from "next";
import { Forbidden } from "@/components/forbidden";
import { listSitePeople } from "@/db/queries/memberships";
import { loadSitePage } from "@/lib/auth/site-page";
import { ROLE_LABELS } from "@/lib/permissions";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("managePeople")) return <Forbidden what="Managing people is for organisation admins." />;
  const people = await listSitePeople({ siteId: site.id });
  return (
    <div>
      <h1 className="mb-4 text-2xl font-bold">People on {site.name}</h1>
      <div className="overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised">
        <table className="w-full text-left">
          <thead className="bg-paper-sunk">
            <tr>
              <th scope="col" className="p-3">Name</th>
              <th scope="col" className="p-3">E-mail</th>
              <th scope="col" className="p-3">Roles</th>
            </tr>
          </thead>
          <tbody>
            {people.map((p) => (
              <tr key={p.userId} className="border-t border-ink/10">
                <td className="p-3 font-semibold">{p.name}</td>
                <td className="p-3">{p.email}</td>
                <td className="p-3">{p.roles.map((r) => ROLE_LABELS[r]).join(", ")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
