"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";
import { Icon } from "@/components/icons";
import type { NavItem } from "@/lib/navigation";

function matches(pathname: string, href: string, exact: boolean) {
  return exact ? pathname === href : pathname === href || pathname.startsWith(`${href}/`);
}

/** The one item to highlight: the most specific link that contains the current path. */
function activeHref(pathname: string, items: NavItem[], rootHref: string) {
  return items
    .filter((i) => matches(pathname, i.href, i.href === rootHref))
    .sort((a, b) => b.href.length - a.href.length)[0]?.href;
}

/** Desktop: a column of links. */
export function SideNav({ items, rootHref }: { items: NavItem[]; rootHref: string }) {
  const current = activeHref(usePathname(), items, rootHref);
  return (
    <nav aria-label="Main" className="flex flex-col gap-1">
      {items.map((item) => {
        const active = item.href === current;
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? "page" : undefined}
            className={`flex min-h-touch items-center gap-3 rounded-lg px-3 font-semibold ${
              active ? "bg-brand text-white" : "text-ink hover:bg-paper-sunk"
            }`}
          >
            <Icon name={item.icon} />
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}

/** Phone: a bottom bar with the primary items, the scan button in the middle and a "More" sheet for the rest. */
export function BottomNav({ items, rootHref }: { items: NavItem[]; rootHref: string }) {
  const current = activeHref(usePathname(), items, rootHref);
  const [open, setOpen] = useState(false);
  const scan = items.find((i) => i.scan);
  const primary = items.filter((i) => i.primary && !i.scan).slice(0, 4);
  const rest = items.filter((i) => !primary.includes(i) && i !== scan);
  const half = Math.ceil(primary.length / 2);
  return (
    <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-20 border-t-2 border-ink/20 bg-paper-raised pb-[env(safe-area-inset-bottom)] md:hidden print:hidden">
      {open && rest.length > 0 ? (
        <ul className="border-b border-ink/10 p-2">
          {rest.map((item) => (
            <li key={item.href}>
              <Link
                href={item.href}
                onClick={() => setOpen(false)}
                aria-current={item.href === current ? "page" : undefined}
                className="flex min-h-touch items-center gap-3 rounded-lg px-3 font-semibold hover:bg-paper-sunk"
              >
                <Icon name={item.icon} /> {item.label}
              </Link>
            </li>
          ))}
        </ul>
      ) : null}
      <ul className="flex">
        {[...primary.slice(0, half), ...(scan ? [scan] : []), ...primary.slice(half)].map((item) => {
          const active = item.href === current;
          if (item === scan) {
            return (
              <li key={item.href} className="flex flex-1 items-center justify-center">
                <Link
                  href={item.href}
                  aria-label={item.label}
                  aria-current={active ? "page" : undefined}
                  className="flex min-h-[56px] min-w-[56px] flex-col items-center justify-center gap-0.5 rounded-xl bg-brand px-1 text-[11px] font-semibold text-white"
                >
                  <Icon name={item.icon} />
                  Scan
                </Link>
              </li>
            );
          }
          return (
            <li key={item.href} className="min-w-0 flex-1">
              <Link
                href={item.href}
                aria-current={active ? "page" : undefined}
                className={`flex min-h-[56px] flex-col items-center justify-center gap-0.5 text-[11px] font-semibold ${active ? "text-brand" : "text-ink-soft"}`}
              >
                <Icon name={item.icon} />
                {item.label}
              </Link>
            </li>
          );
        })}
        {rest.length > 0 ? (
          <li className="flex-1">
            <button
              type="button"
              aria-expanded={open}
              onClick={() => setOpen((o) => !o)}
              className="flex min-h-[56px] w-full flex-col items-center justify-center gap-0.5 text-[11px] font-semibold text-ink-soft"
            >
              <Icon name="more" />
              More
            </button>
          </li>
        ) : null}
      </ul>
    </nav>
  );
}
