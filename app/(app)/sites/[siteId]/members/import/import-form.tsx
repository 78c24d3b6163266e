"use client";
// Sends the chosen CSV to the import API and shows the outcome: counts, or every problem by row.
import Link from "next/link";
import { useRef, useState } from "react";
import { Icon } from "@/components/icons";
import { Button } from "@/components/ui/button";
import { Field, describedBy, inputClass } from "@/components/ui/field";

type Problem = { row: number; field: string; reason: string };
type Outcome =
  | { kind: "done"; created: number; failing: number }
  | { kind: "rejected"; message: string; rows: Problem[] }
  | { kind: "error"; message: string; fields: Record<string, string> };

export function ImportForm({ siteId }: { siteId: string }) {
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const [fileError, setFileError] = useState<string>();
  const [outcome, setOutcome] = useState<Outcome>();

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const file = input.current?.files?.[0];
    setOutcome(undefined);
    if (!file) return setFileError("Choose a CSV file to import.");
    setFileError(undefined);
    setBusy(true);
    try {
      const form = new FormData();
      form.set("file", file);
      const res = await fetch(`/api/v1/sites/${siteId}/members/import`, { method: "POST", body: form });
      const body = await res.json().catch(() => null);
      if (res.status === 201) setOutcome({ kind: "done", created: body.created, failing: body.failing });
      else if (body?.error?.rows) setOutcome({ kind: "rejected", message: body.error.message, rows: body.error.rows });
      else {
        const fields: Record<string, string> = body?.error?.fields ?? {};
        if (fields.file) setFileError(fields.file);
        setOutcome({ kind: "error", message: body?.error?.message ?? `The import failed (HTTP ${res.status}); nothing was imported.`, fields });
      }
    } catch {
      setOutcome({ kind: "error", message: "The file could not be sent; check the connection and try again. Nothing was imported.", fields: {} });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-4">
      <form onSubmit={submit} className="flex flex-col gap-3 rounded-xl border-2 border-ink/10 bg-paper-raised p-4" noValidate>
        <Field id="import-file" label="CSV file" error={fileError}>
          <input
            ref={input}
            id="import-file"
            name="file"
            type="file"
            accept=".csv,text/csv"
            className={inputClass}
            aria-invalid={fileError ? true : undefined}
            aria-describedby={describedBy("import-file", fileError)}
            onChange={() => {
              setFileError(undefined);
              setOutcome(undefined);
            }}
          />
        </Field>
        <div>
          <Button type="submit" disabled={busy}>
            {busy ? "Checking and importing…" : "Import"}
          </Button>
        </div>
      </form>

      {outcome?.kind === "done" ? (
        <div role="status" className="flex items-start gap-3 rounded-lg border-2 border-ok bg-ok-soft p-4">
          <Icon name="ok" className="h-6 w-6 shrink-0 text-ok" />
          <div>
            <p className="font-bold">
              Imported {outcome.created} member{outcome.created === 1 ? "" : "s"} as drafts.
            </p>
            {outcome.failing > 0 ? (
              <p className="font-semibold text-bad">
                {outcome.failing} of them fail{outcome.failing === 1 ? "s" : ""} the capacity check.{" "}
                <Link className="underline" href={`/sites/${siteId}/members?pass=false&sort=updated&dir=desc`}>
                  See the failing members
                </Link>
              </p>
            ) : (
              <p>Every imported member passes its capacity check.</p>
            )}
            <Link className="font-semibold text-brand underline" href={`/sites/${siteId}/members?sort=updated&dir=desc`}>
              Open the register
            </Link>
          </div>
        </div>
      ) : null}

      {outcome?.kind === "rejected" ? (
        <section aria-labelledby="import-report-h" className="flex flex-col gap-2 rounded-lg border-2 border-bad bg-bad-soft p-4">
          <h2 id="import-report-h" role="alert" className="flex items-start gap-2 font-bold">
            <Icon name="bad" className="h-6 w-6 shrink-0 text-bad" /> {outcome.message}
          </h2>
          <div className="overflow-x-auto rounded-lg bg-paper-raised">
            <table className="tabular w-full text-left text-sm" aria-label="Import problems">
              <thead className="bg-paper-sunk">
                <tr>
                  <th scope="col" className="px-2 py-1">
                    Row
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Column
                  </th>
                  <th scope="col" className="px-2 py-1">
                    Problem
                  </th>
                </tr>
              </thead>
              <tbody>
                {outcome.rows.map((p, i) => (
                  <tr key={i} className="border-t border-ink/10 align-top">
                    <td className="px-2 py-1 font-semibold">{p.row}</td>
                    <td className="px-2 py-1">
                      <code>{p.field}</code>
                    </td>
                    <td className="px-2 py-1">{p.reason}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="text-sm">Row numbers are the lines of the file as a spreadsheet shows them (the column names are row 1).</p>
        </section>
      ) : null}

      {outcome?.kind === "error" ? (
        <div role="alert" className="flex items-start gap-3 rounded-lg border-2 border-bad bg-bad-soft p-4">
          <Icon name="bad" className="h-6 w-6 shrink-0 text-bad" />
          <div>
            <p className="font-bold">{outcome.message}</p>
            {Object.entries(outcome.fields)
              .filter(([k]) => k !== "file")
              .map(([k, v]) => (
                <p key={k}>{v}</p>
              ))}
          </div>
        </div>
      ) : null}
    </div>
  );
}
