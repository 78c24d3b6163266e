// Helpers for the onboarding tests: read the link an e-mail carries from the outbox, invite a
// fresh person and accept for them.
import { sql } from "@/db";
import { anonymous, signInAs, type Client } from "./http";

export const GOOD_PASSWORD = "violet harbour crane 47";

let n = 0;
export function freshEmail(what = "person") {
  n += 1;
  return `${what}-${Date.now().toString(36)}-${n}@onboarding.example`;
}

/** The newest e-mail of a kind queued for an address, and the token in its link. */
export async function latestLink(email: string, kind: "invitation" | "password_reset") {
  const rows = await sql<{ text: string; subject: string }[]>`
    select text, subject from outbox where lower(to_email) = ${email.toLowerCase()} and kind = ${kind} order by created_at desc limit 1`;
  const text = rows[0]?.text ?? "";
  const m = text.match(/\/(?:invite|reset-password)\/([A-Za-z0-9_-]{43})/);
  return { token: m?.[1] ?? null, text, subject: rows[0]?.subject ?? null };
}

export async function countOutbox(email: string, kind: string) {
  const [row] = await sql<{ n: number }[]>`select count(*)::int as n from outbox where lower(to_email) = ${email.toLowerCase()} and kind = ${kind}`;
  return row!.n;
}

/** Admin invites a new address to the site; the invitee accepts with a good password and signs in. */
export async function invitePerson(admin: Client, siteId: string, roles: string[], what = "person") {
  const email = freshEmail(what);
  const inv = await admin.json<{ invitation: { id: string } }>(`/api/v1/sites/${siteId}/invitations`, { method: "POST", body: { email, name: `Test ${what}`, roles } });
  if (inv.status !== 201) throw new Error(`invite failed: ${inv.status} ${JSON.stringify(inv.body)}`);
  const { token } = await latestLink(email, "invitation");
  const accepted = await anonymous().json<{ user: { id: string } }>(`/api/v1/invitations/${token}/accept`, { method: "POST", body: { name: `Test ${what}`, password: GOOD_PASSWORD } });
  if (accepted.status !== 201) throw new Error(`accept failed: ${accepted.status} ${JSON.stringify(accepted.body)}`);
  const client = await signInAs(email, GOOD_PASSWORD);
  return { email, userId: accepted.body.user.id, invitationId: inv.body.invitation.id, client };
}
