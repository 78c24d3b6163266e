import type { Metadata } from "next";
import Link from "next/link";
import { AppShell } from "@/components/app-shell";
import { listUserSites } from "@/db/queries/users";
import { requireUser } from "@/lib/auth";
import { ROLE_LABELS } from "@/lib/permissions";
import type { SiteRole } from "@/db/schema";

export const metadata: Metadata = { title: "Sites" };

export default async function SitesPage() {
  const user = await requireUser("/sites");
  const sites = await listUserSites({ user });
  return (
    <AppShell user={user} nav={[{ href: "/sites", label: "Sites", icon: "sites", primary: true }]} rootHref="/sites" context={user.organisationName}>
      <h1 className="mb-4 text-2xl font-bold">Your sites</h1>
      {sites.length === 0 ? (
        <p className="rounded-lg border-2 border-ink/20 bg-paper-raised p-4">
          You do not hold a role on any site yet. Ask your organisation admin to add you to one.
        </p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2">
          {sites.map((s) => (
            <li key={s.id}>
              <Link href={`/sites/${s.id}`} className="block min-h-touch rounded-xl border-2 border-ink/15 bg-paper-raised p-4 hover:border-brand">
                <p className="text-lg font-bold">{s.name}</p>
                <p className="text-sm text-ink-soft">
                  {s.code}
                  {s.address ? ` · ${s.address}` : ""}
                </p>
                <p className="mt-2 text-sm">
                  <span className="font-semibold">Your roles:</span> {s.roles.map((r) => ROLE_LABELS[r as SiteRole]).join(", ")}
                </p>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </AppShell>
  );
}
