import Link from "next/link";
import { Icon } from "@/components/icons";
import { countPermitsAwaitingReview } from "@/db/queries/permits";

/** For the coordinator's overview: how many permit requests wait for review, linked to them. */
export async function PermitsAwaitingReview({ siteId }: { siteId: string }) {
  const n = await countPermitsAwaitingReview({ siteId });
  if (n === 0) return null;
  return (
    <Link
      href={`/sites/${siteId}/permits?status=requested&sort=requested&dir=asc`}
      className="flex min-h-touch items-center gap-2 rounded-lg border-2 border-brand bg-brand-soft p-3 font-semibold text-brand-strong"
    >
      <Icon name="permit" /> Permits needing review: {n}
    </Link>
  );
}
