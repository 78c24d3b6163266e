import type { Metadata } from "next";
import Link from "next/link";
import { listPreferences } from "@/db/queries/alerts";
import { loadSitePage } from "@/lib/auth/site-page";
import { ALERT_KIND_LABELS, ALERT_KINDS, ALERT_RECIPIENT_ROLES, ALWAYS_EMAIL_MANAGER, DEFAULT_DELIVERY, type Delivery } from "@/lib/alerts/kinds";
import { ROLE_LABELS } from "@/lib/permissions";
import { PreferencesForm } from "./preferences-form";

export const metadata: Metadata = { title: "Alert settings" };

export default async function AlertSettingsPage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, user, roles } = await loadSitePage(siteId);
  const saved = await listPreferences({ userIds: [user.id] });
  const rows = ALERT_KINDS.map((kind) => ({
    kind,
    label: ALERT_KIND_LABELS[kind],
    delivery: (saved.find((p) => p.kind === kind)?.delivery ?? DEFAULT_DELIVERY) as Delivery,
    receives: roles.some((r) => ALERT_RECIPIENT_ROLES[kind].includes(r)),
    locked: ALWAYS_EMAIL_MANAGER.includes(kind) && roles.includes("manager"),
    who: ALERT_RECIPIENT_ROLES[kind].map((r) => ROLE_LABELS[r].toLowerCase()).join(" and "),
  }));
  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-sm text-ink-soft">
          <Link href={`/sites/${site.id}/alerts`} className="underline">
            Alerts
          </Link>{" "}
          › How I get alerts
        </p>
        <h1 className="text-2xl font-bold">How I get alerts</h1>
        <p className="text-ink-soft">
          For each kind: an e-mail at once, one daily digest e-mail (about 07:00) listing them, or only here in the app. Every alert is always listed on the
          alerts page. These settings apply on all your sites.
        </p>
      </div>
      <PreferencesForm rows={rows} />
    </div>
  );
}
