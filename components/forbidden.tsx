import { Icon } from "@/components/icons";

export function Forbidden({ what }: { what: string }) {
  return (
    <div role="alert" className="flex items-start gap-3 rounded-lg border-2 border-bad bg-bad-soft p-4">
      <Icon name="bad" className="h-6 w-6 text-bad" />
      <div>
        <p className="font-bold">Not available to your role</p>
        <p>{what} Ask the site&apos;s coordinator or your organisation admin if you need it.</p>
      </div>
    </div>
  );
}
