import type { Metadata } from "next";
import { ApiButton, ApiForm } from "@/app/_onboarding/api-form";
import { siteFormFields } from "@/app/_onboarding/site-fields";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { loadSitePage } from "@/lib/auth/site-page";
import { basisFor } from "@/lib/validations/onboarding";

export const metadata: Metadata = { title: "Site settings" };

export default async function SiteSettingsPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  if (!may("manageSite")) return <Forbidden what="Site settings are for organisation admins." />;
  const archived = !!site.archivedAt;
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-6">
      <h1 className="text-2xl font-bold">Settings for {site.name}</h1>
      {archived ? (
        <p role="status" className="flex items-start gap-2 rounded-lg border-2 border-warn bg-warn-soft p-3 font-semibold">
          <Icon name="warn" className="h-6 w-6 shrink-0" /> Archived: this site is read-only and hidden from the sites list. Its register, permits and history are kept.
        </p>
      ) : null}
      <ApiForm
        testId="site-settings"
        url={`/api/v1/sites/${site.id}`}
        method="PATCH"
        fields={siteFormFields({
          name: site.name,
          code: site.code,
          address: site.address,
          units: site.unitSystem,
          basis: basisFor(site.designCode),
          inspectionIntervalDays: site.inspectionIntervalDays,
          permitValidityDays: Math.max(1, Math.round(site.permitValidityHours / 24)),
          permitWarningHours: site.expiryWarningHours,
          timezone: site.timezone,
        })}
        submitLabel="Save settings"
        then={{ kind: "refresh", text: "Settings saved." }}
      />
      <section className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 className="mb-2 text-lg font-bold">{archived ? "Restore the site" : "Archive the site"}</h2>
        <p className="mb-3 text-ink-soft">
          {archived
            ? "Restoring makes the site editable again and lists it with the others."
            : "When the works are finished: the site becomes read-only and leaves the sites list; nothing is deleted."}
        </p>
        <ApiButton
          url={`/api/v1/sites/${site.id}`}
          method="PATCH"
          body={{ archived: !archived }}
          label={archived ? "Restore the site" : "Archive the site"}
          variant={archived ? "primary" : "danger"}
          confirm={archived ? undefined : `Archive ${site.name}? It becomes read-only; its data is kept.`}
        />
      </section>
    </div>
  );
}
