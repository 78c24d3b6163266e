import type { Metadata } from "next";
import Link from "next/link";
import { AppShell } from "@/components/app-shell";
import { Icon } from "@/components/icons";
import { ButtonLink } from "@/components/ui/button";
import { listUserSites } from "@/db/queries/users";
import { requireUser } from "@/lib/auth";
import { ROLE_LABELS } from "@/lib/permissions";
import type { SiteRole } from "@/db/schema";

export const metadata: Metadata = { title: "Sites" };

export default async function SitesPage({ searchParams }: { searchParams: Promise<{ archived?: string }> }) {
  const user = await requireUser("/sites");
  const showArchived = (await searchParams).archived === "include";
  const sites = await listUserSites({ user, includeArchived: showArchived });
  return (
    <AppShell user={user} nav={[{ href: "/sites", label: "Sites", icon: "sites", primary: true }]} rootHref="/sites" context={user.organisationName}>
      <div className="mb-4 flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-2xl font-bold">Your sites</h1>
        {user.isOrgAdmin ? (
          <div className="flex flex-wrap gap-2">
            <ButtonLink href={showArchived ? "/sites" : "/sites?archived=include"} variant="secondary">
              {showArchived ? "Hide archived sites" : "Show archived sites"}
            </ButtonLink>
            <ButtonLink href="/sites/new">
              <Icon name="add" /> Add a site
            </ButtonLink>
          </div>
        ) : null}
      </div>
      {sites.length === 0 ? (
        <p className="rounded-lg border-2 border-ink/20 bg-paper-raised p-4">
          {user.isOrgAdmin
            ? "Your organisation has no sites yet. Add the first one, then invite your team to it."
            : "You do not hold a role on any site yet. Ask your organisation admin to add you to one."}
        </p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2">
          {sites.map((s) => (
            <li key={s.id}>
              <Link href={`/sites/${s.id}`} className="block min-h-touch rounded-xl border-2 border-ink/15 bg-paper-raised p-4 hover:border-brand">
                <p className="text-lg font-bold">{s.name}</p>
                {s.archivedAt ? (
                  <p className="inline-flex items-center gap-1 text-sm font-semibold text-warn">
                    <Icon name="warn" className="h-4 w-4" /> Archived (read-only)
                  </p>
                ) : null}
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
