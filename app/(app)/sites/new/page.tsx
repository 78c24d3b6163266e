import type { Metadata } from "next";
import { ApiForm } from "@/app/_onboarding/api-form";
import { siteFormFields } from "@/app/_onboarding/site-fields";
import { AppShell } from "@/components/app-shell";
import { Forbidden } from "@/components/forbidden";
import { requireUser } from "@/lib/auth";

export const metadata: Metadata = { title: "Add a site" };

export default async function NewSitePage() {
  const user = await requireUser("/sites/new");
  return (
    <AppShell user={user} nav={[{ href: "/sites", label: "Sites", icon: "sites", primary: true }]} rootHref="/sites" context={user.organisationName}>
      <div className="mx-auto max-w-xl">
        <h1 className="mb-4 text-2xl font-bold">Add a site</h1>
        {user.isOrgAdmin ? (
          <ApiForm testId="site" url="/api/v1/sites" fields={siteFormFields()} submitLabel="Add the site" busyLabel="Adding…" then={{ kind: "redirect", href: "/sites/:id/people", idPath: "site.id" }} />
        ) : (
          <Forbidden what="Adding sites is for organisation admins." />
        )}
      </div>
    </AppShell>
  );
}
