import Link from "next/link";
import type { ReactNode } from "react";
import { DraftOwnerProvider } from "@/components/draft-owner";
import { Icon } from "@/components/icons";
import { BottomNav, SideNav } from "@/components/nav-links";
import { OfflineSupport } from "@/components/offline/offline-support";
import { OutboxBadge } from "@/components/offline/outbox-badge";
import type { SessionUser } from "@/lib/auth";
import type { NavItem } from "@/lib/navigation";

/** Signed-in frame: side navigation on desktop, bottom navigation on a phone. */
export function AppShell({
  user, nav, rootHref, context, children,
}: { user: SessionUser; nav: NavItem[]; rootHref: string; context?: ReactNode; children: ReactNode }) {
  return (
    <div className="min-h-dvh md:grid md:grid-cols-[15rem_1fr] print:block">
      <aside className="hidden border-r-2 border-ink/10 bg-paper-raised p-4 md:block print:hidden">
        <Link href="/sites" className="mb-6 flex items-center gap-2 text-xl font-bold">
          <img src="/icon.svg" alt="" width={32} height={32} /> Strutwise
        </Link>
        {context ? <div className="mb-4 text-sm text-ink-soft">{context}</div> : null}
        <SideNav items={nav} rootHref={rootHref} />
      </aside>
      <div className="flex min-w-0 flex-col pb-24 md:pb-0 print:pb-0">
        <header className="sticky top-0 z-10 print:hidden flex items-center justify-between gap-2 border-b-2 border-ink/10 bg-paper-raised px-4 py-2">
          <div className="flex min-w-0 items-center gap-2 md:hidden">
            <Link href="/sites" aria-label="All sites" className="flex min-h-touch min-w-touch items-center">
              <img src="/icon.svg" alt="" width={28} height={28} />
            </Link>
            {context ? <div className="truncate text-sm font-semibold">{context}</div> : null}
          </div>
          <div className="hidden md:block" />
          <div className="flex items-center gap-2">
          <OutboxBadge userId={user.id} />
          <details className="relative">
            <summary className="flex min-h-touch cursor-pointer list-none items-center gap-2 rounded-lg px-2 font-semibold hover:bg-paper-sunk" aria-label="Account menu">
              <Icon name="user" />
              <span className="hidden sm:inline">{user.name}</span>
            </summary>
            <div className="absolute right-0 mt-1 w-64 rounded-lg border-2 border-ink/20 bg-paper-raised p-3 shadow-lg">
              <p className="font-semibold">{user.name}</p>
              <p className="truncate text-sm text-ink-soft">{user.email}</p>
              <p className="mb-2 text-sm text-ink-soft">{user.organisationName}</p>
              <Link href="/sites" className="flex min-h-touch items-center rounded px-2 hover:bg-paper-sunk">
                All my sites
              </Link>
              <Link href="/account" className="flex min-h-touch items-center rounded px-2 hover:bg-paper-sunk">
                Change password
              </Link>
              <Link href="/sign-out" className="flex min-h-touch items-center rounded px-2 hover:bg-paper-sunk">
                Sign out
              </Link>
            </div>
          </details>
          </div>
        </header>
        {/* When this page was made: a copy kept for offline use shows it in the offline banner. */}
        <OfflineSupport renderedAt={new Date().toISOString()} siteRoot={rootHref.startsWith("/sites/") ? rootHref : undefined} />
        <main className="mx-auto w-full max-w-6xl flex-1 p-4 md:p-6 print:max-w-none print:p-0">
          <DraftOwnerProvider userId={user.id}>{children}</DraftOwnerProvider>
        </main>
      </div>
      <BottomNav items={nav} rootHref={rootHref} />
    </div>
  );
}
