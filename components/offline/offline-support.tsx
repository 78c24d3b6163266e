"use client";
// Registers the service worker, asks it to keep the pages of a round while there is signal, and
// says so when what is shown was loaded earlier: "Offline — showing what was loaded at 14:32".
import { formatTime } from "@/lib/format-date";
import { usePathname } from "next/navigation";
import { useEffect, useState } from "react";
import { Icon } from "@/components/icons";
import { loadedAtText } from "@/lib/client/format";
import { serverReachable } from "@/lib/client/outbox/reachable";
import { KEPT_KEY_PREFIX } from "@/lib/client/sw/cache-names";

/** The pages a site engineer needs on a round, for the site in view. */
function roundPages(siteRoot: string) {
  return [siteRoot, `${siteRoot}/members/new`, `${siteRoot}/inspections`, `${siteRoot}/library`, `${siteRoot}/schemes`, `${siteRoot}/members`];
}

/**
 * For every site the person belongs to (not only the one in view): the member library, zones and
 * schemes as the API gives them, and Log member (which carries them), so a round that moves to
 * another site still logs and checks members with no signal.
 */
async function everySiteReads(): Promise<string[]> {
  try {
    const res = await fetch("/api/v1/sites", { credentials: "same-origin" });
    if (!res.ok) return [];
    const { items } = (await res.json()) as { items: { id: string; archived: boolean }[] };
    return items
      .filter((s) => !s.archived)
      .slice(0, 20)
      .flatMap((s) => [`/api/v1/sites/${s.id}/member-types`, `/api/v1/sites/${s.id}/zones`, `/api/v1/sites/${s.id}/schemes`, `/sites/${s.id}/members/new`]);
  } catch {
    return [];
  }
}

export function OfflineSupport({ renderedAt, siteRoot }: { renderedAt: string; siteRoot?: string }) {
  const [offline, setOffline] = useState(false);
  const pathname = usePathname();

  useEffect(() => {
    let live = true;
    const update = () => void serverReachable().then((ok) => live && setOffline(!ok));
    update();
    // Signal comes and goes underground: look again every 20 seconds.
    const timer = window.setInterval(update, 20_000);
    window.addEventListener("online", update);
    window.addEventListener("offline", update);
    return () => {
      live = false;
      window.clearInterval(timer);
      window.removeEventListener("online", update);
      window.removeEventListener("offline", update);
    };
  }, []);

  useEffect(() => {
    if (!("serviceWorker" in navigator) || !navigator.onLine) return;
    let cancelled = false;
    // Registered at once; the round's pages are fetched only after the person has stayed on a page
    // for a while, so the extra page renders never compete with what they are doing right now.
    void navigator.serviceWorker.register("/sw.js", { scope: "/" }).catch(() => undefined);
    const timer = window.setTimeout(() => void (async () => {
      try {
        await navigator.serviceWorker.register("/sw.js", { scope: "/" });
        const reg = await navigator.serviceWorker.ready;
        if (cancelled || !reg.active) return;
        // This page's inspection checklists too (the round lists them), so each can be done offline,
        // and a member page opened within the app (a full page load is kept by the worker itself).
        const links = [...document.querySelectorAll<HTMLAnchorElement>('main a[href$="/inspect"]')].map((a) => new URL(a.href).pathname);
        const seen = /\/members\/[0-9a-f-]{36}(\/inspect)?$/.test(pathname) ? [pathname] : [];
        // The round's pages at most every ten minutes: each is a page the server renders again.
        const key = `${KEPT_KEY_PREFIX}${siteRoot ?? ""}`;
        const last = Number(sessionStorage.getItem(key) ?? 0);
        const due = Date.now() - last > 10 * 60_000;
        const round = siteRoot && due ? roundPages(siteRoot) : [];
        const everySite = due ? await everySiteReads() : [];
        if (due) sessionStorage.setItem(key, String(Date.now()));
        if (cancelled) return;
        const urls = [...new Set([...round, ...seen, ...links, ...everySite])];
        if (urls.length) reg.active.postMessage({ type: "keep", urls });
      } catch {
        /* no service worker (not built in development): the app still works online */
      }
    })(), 8_000);
    return () => {
      cancelled = true;
      window.clearTimeout(timer);
    };
  }, [pathname, siteRoot]);

  if (!offline) return null;
  const at = loadedAtText(renderedAt);
  return (
    <div role="status" className="flex items-center gap-2 border-b-2 border-warn bg-warn-soft px-4 py-2 text-sm font-semibold print:hidden" data-testid="offline-banner">
      <Icon name="warn" className="h-5 w-5 shrink-0" />
      <span>
        Offline — showing what was loaded at <time dateTime={renderedAt}>{at}</time> (the last refresh with signal). What you save waits on this phone and is sent when you have signal.
      </span>
    </div>
  );
}
