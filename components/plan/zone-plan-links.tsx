// Links to each zone's plan (overview and register), saying which zones have no plan yet.
import { Icon } from "@/components/icons";

export function ZonePlanLinks({ siteId, zones, title = "Zone plans" }: { siteId: string; zones: { id: string; name: string; hasPlan: boolean }[]; title?: string }) {
  if (zones.length === 0) return null;
  return (
    <nav aria-label={title} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-3 print:hidden">
      <h2 className="mb-2 font-bold">{title}</h2>
      <ul className="flex flex-wrap gap-2">
        {zones.map((z) => (
          <li key={z.id}>
            <a href={`/sites/${siteId}/zones/${z.id}/plan`} className="inline-flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/30 px-3 font-semibold hover:bg-paper-sunk">
              <Icon name={z.hasPlan ? "overview" : "warn"} className="h-4 w-4" />
              {z.name}
              {z.hasPlan ? null : <span className="text-sm font-normal text-ink-soft">(no plan yet)</span>}
            </a>
          </li>
        ))}
      </ul>
    </nav>
  );
}
