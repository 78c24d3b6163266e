import type { Metadata } from "next";
import { ApiButton, ApiForm } from "@/app/_onboarding/api-form";
import { Forbidden } from "@/components/forbidden";
import { Icon } from "@/components/icons";
import { listPendingInvitations } from "@/db/queries/invitations";
import { listSitePeople } from "@/db/queries/memberships";
import { formatDateTime } from "@/lib/format-date";
import { loadSitePage } from "@/lib/auth/site-page";
import { ALL_ROLES, ROLE_LABELS, rolesAllowPure } from "@/lib/permissions";

export const metadata: Metadata = { title: "People" };

const roleOptions = ALL_ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export default async function PeoplePage({ params }: { params: Promise<{ siteId: string }> }) {
  const { siteId } = await params;
  const { site, user, roles } = await loadSitePage(siteId);
  // Readable on an archived site too (changes are refused there, see below).
  if (!rolesAllowPure(roles, "managePeople")) return <Forbidden what="Managing people is for organisation admins." />;
  const [people, invitations] = await Promise.all([listSitePeople({ siteId: site.id }), listPendingInvitations({ siteId: site.id })]);
  const readOnly = !!site.archivedAt;
  return (
    <div className="flex flex-col gap-8">
      <h1 className="text-2xl font-bold">People on {site.name}</h1>

      <section aria-labelledby="team">
        <h2 id="team" className="mb-3 text-lg font-bold">
          Team ({people.length})
        </h2>
        {people.length === 0 ? <p className="rounded-lg border-2 border-ink/20 bg-paper-raised p-4">Nobody holds a role on this site yet. Invite your team below.</p> : null}
        <ul className="grid gap-3 lg:grid-cols-2">
          {people.map((p) => (
            <li key={p.userId} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4" data-testid="person">
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div className="min-w-0">
                  <p className="font-bold">
                    {p.name}
                    {p.userId === user.id ? " (you)" : ""}
                  </p>
                  <p className="truncate text-sm text-ink-soft">{p.email}</p>
                </div>
                {p.active ? (
                  <span className="inline-flex items-center gap-1 rounded-full bg-ok-soft px-2 py-1 text-sm font-semibold text-ok">
                    <Icon name="ok" className="h-4 w-4" /> Active
                  </span>
                ) : (
                  <span className="inline-flex items-center gap-1 rounded-full bg-bad-soft px-2 py-1 text-sm font-semibold text-bad">
                    <Icon name="bad" className="h-4 w-4" /> Deactivated
                  </span>
                )}
              </div>
              <p className="mt-2 text-sm">
                <span className="font-semibold">Roles:</span> {p.roles.map((r) => ROLE_LABELS[r]).join(", ")}
                {p.isOrgAdmin ? " · organisation admin on every site" : ""}
              </p>
              {readOnly ? null : (
                <details className="mt-3">
                  <summary className="flex min-h-touch cursor-pointer items-center font-semibold text-brand">Change roles or remove</summary>
                  <div className="mt-2 flex flex-col gap-3">
                    <ApiForm
                      testId={`roles-${p.userId}`}
                      url={`/api/v1/sites/${site.id}/people/${p.userId}`}
                      method="PUT"
                      fields={[{ name: "roles", label: `Roles of ${p.name} on this site`, type: "checkboxes", options: roleOptions, defaultValue: p.roles }]}
                      submitLabel="Save roles"
                      then={{ kind: "refresh", text: "Roles saved. They apply from the person's next action." }}
                    />
                    <div className="flex flex-wrap gap-2">
                      <ApiButton
                        url={`/api/v1/sites/${site.id}/people/${p.userId}`}
                        method="DELETE"
                        label="Remove from this site"
                        variant="danger"
                        confirm={`Remove ${p.name} from ${site.name}? They lose access at once.`}
                      />
                      {user.isOrgAdmin && p.userId !== user.id ? (
                        p.active ? (
                          <ApiButton
                            url={`/api/v1/people/${p.userId}/deactivate`}
                            label="Deactivate account"
                            variant="danger"
                            confirm={`Deactivate ${p.name} for the whole organisation? They are signed out on every device.`}
                          />
                        ) : (
                          <ApiButton url={`/api/v1/people/${p.userId}/reactivate`} label="Reactivate account" />
                        )
                      ) : null}
                    </div>
                  </div>
                </details>
              )}
            </li>
          ))}
        </ul>
      </section>

      {readOnly ? (
        <p className="rounded-lg border-2 border-warn bg-warn-soft p-3 font-semibold">
          <Icon name="warn" className="mr-1 inline h-5 w-5 align-text-bottom" /> This site is archived: people and invitations cannot be changed.
        </p>
      ) : (
        <div className="grid gap-8 lg:grid-cols-2">
          <section aria-labelledby="invite" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
            <h2 id="invite" className="mb-3 text-lg font-bold">
              Invite someone
            </h2>
            <ApiForm
              testId="invite"
              url={`/api/v1/sites/${site.id}/invitations`}
              fields={[
                { name: "email", label: "E-mail", type: "email", inputMode: "email", autoComplete: "off" },
                { name: "name", label: "Name (optional)", type: "text", autoComplete: "off" },
                { name: "roles", label: "Roles on this site", type: "checkboxes", options: roleOptions },
              ]}
              submitLabel="Send the invitation"
              busyLabel="Sending…"
              resetOnSuccess
              then={{ kind: "refresh", text: "Invitation sent. The link works once, for 7 days." }}
            />
          </section>
          <section aria-labelledby="pending">
            <h2 id="pending" className="mb-3 text-lg font-bold">
              Pending invitations ({invitations.length})
            </h2>
            {invitations.length === 0 ? <p className="text-ink-soft">No invitation is waiting to be accepted.</p> : null}
            <ul className="flex flex-col gap-3">
              {invitations.map((i) => (
                <li key={i.id} className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4" data-testid="invitation">
                  <p className="font-bold">{i.name ? `${i.name} · ${i.email}` : i.email}</p>
                  <p className="text-sm">
                    <span className="inline-flex items-center gap-1 font-semibold text-warn">
                      <Icon name="warn" className="h-4 w-4" /> Waiting
                    </span>{" "}
                    · {i.roles.map((r) => ROLE_LABELS[r]).join(", ")}
                  </p>
                  <p className="text-sm text-ink-soft">
                    Link valid until {formatDateTime(i.expiresAt, site.timezone)}
                    {i.sendCount > 1 ? ` · sent ${i.sendCount} times` : ""}
                  </p>
                  <div className="mt-2 flex flex-wrap gap-2">
                    <ApiButton url={`/api/v1/sites/${site.id}/invitations/${i.id}/resend`} label="Resend" busyLabel="Sending…" />
                    <ApiButton url={`/api/v1/sites/${site.id}/invitations/${i.id}`} method="DELETE" label="Revoke" variant="danger" confirm={`Revoke the invitation to ${i.email}? The link stops working.`} />
                  </div>
                </li>
              ))}
            </ul>
          </section>
        </div>
      )}
    </div>
  );
}
