// The daily digest: one e-mail per person listing the alerts they chose to receive that way.
import { renderEmail } from "./layout";

export function renderAlertDigest({
  name, day, items, link,
}: { name: string; day: string; items: { siteName: string; kindLabel: string; title: string }[]; link: string }) {
  const sites = [...new Set(items.map((i) => i.siteName))];
  return renderEmail({
    title: `Strutwise daily digest for ${day}: ${items.length} alert${items.length === 1 ? "" : "s"}`,
    paragraphs: [
      `Hello ${name}, these alerts were raised in the last 24 hours on sites where you receive them as a digest.`,
      ...sites.flatMap((s) => [`${s}:`, ...items.filter((i) => i.siteName === s).map((i) => `• ${i.kindLabel}: ${i.title}`)]),
      "You can change how you receive each kind of alert on the alert settings page.",
    ],
    link: { href: link, label: "Open your alerts" },
    caution: true,
  });
}
