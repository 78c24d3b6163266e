// The e-mail for one alert, or for several of one kind raised by the same scan on one site.
import { renderEmail } from "./layout";

export type AlertForEmail = { title: string; body: string; link: string | null; siteName: string; kindLabel: string };

export function absoluteLink(appUrl: string, link: string | null, fallback: string) {
  return new URL(link ?? fallback, appUrl).toString();
}

export function renderAlertEmail(alerts: AlertForEmail[], { appUrl, alertsPath }: { appUrl: string; alertsPath: string }) {
  const first = alerts[0]!;
  if (alerts.length === 1) {
    return renderEmail({
      title: first.title,
      paragraphs: [first.body],
      facts: [["Site", first.siteName], ["Alert", first.kindLabel]],
      link: { href: absoluteLink(appUrl, first.link, alertsPath), label: "Open in Strutwise" },
      caution: true,
    });
  }
  return renderEmail({
    title: `${alerts.length} alerts: ${first.kindLabel} — ${first.siteName}`,
    paragraphs: [`${alerts.length} new alerts of this kind were raised on ${first.siteName}:`, ...alerts.map((a) => `• ${a.title}`)],
    facts: [["Site", first.siteName], ["Alert", first.kindLabel]],
    link: { href: absoluteLink(appUrl, null, alertsPath), label: "See the alerts" },
    caution: true,
  });
}
