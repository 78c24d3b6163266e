"use client";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Icon } from "@/components/icons";
import { apiJson } from "@/lib/client/api";

function useAction(path: string) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const run = () =>
    start(async () => {
      const r = await apiJson(path, { body: {} });
      if (!r.ok) setError(r.error.message);
      else {
        setError(null);
        router.refresh();
      }
    });
  return { run, pending, error };
}

export function MarkRead({ alertId, title }: { alertId: string; title: string }) {
  const { run, pending, error } = useAction(`/api/v1/alerts/${alertId}/read`);
  return (
    <>
      <button
        type="button"
        onClick={run}
        disabled={pending}
        aria-label={`Mark read: ${title}`}
        className="flex min-h-touch items-center gap-1 rounded-lg bg-brand px-3 font-semibold text-white hover:bg-brand-strong disabled:opacity-50"
      >
        <Icon name="ok" className="h-5 w-5" /> Mark read
      </button>
      {error ? <p role="alert" className="text-sm font-semibold text-bad">{error}</p> : null}
    </>
  );
}

export function MarkAllRead({ siteId }: { siteId: string }) {
  const { run, pending, error } = useAction(`/api/v1/sites/${siteId}/alerts/read`);
  return (
    <>
      <button type="button" onClick={run} disabled={pending} className="flex min-h-touch items-center gap-1 rounded-lg border-2 border-ink/70 px-3 font-semibold hover:bg-paper-sunk disabled:opacity-50">
        <Icon name="ok" className="h-5 w-5" /> Mark all read
      </button>
      {error ? <p role="alert" className="text-sm font-semibold text-bad">{error}</p> : null}
    </>
  );
}
