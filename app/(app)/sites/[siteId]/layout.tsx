import { AppShell } from "@/components/app-shell";
import { loadSitePage } from "@/lib/auth/site-page";
import { siteNav } from "@/lib/navigation";

export default async function SiteLayout({ children, params }: { children: React.ReactNode; params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { user, site, roles } = await loadSitePage(siteId);
  return (
    <AppShell user={user} nav={siteNav(site.id, roles)} rootHref={`/sites/${site.id}`} context={site.name}>
      {children}
    </AppShell>
  );
}
