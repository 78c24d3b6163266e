// Issuing scope a coordinator gives a supervisor: which zones, until when; who gave it and when.
import { listDelegations } from "@/db/queries/permits";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { delegateIssuing } from "@/lib/permits";
import { delegationSchema } from "@/lib/validations/permit";

export const GET = siteRoute({ resource: "site", permission: "viewSite" }, async ({ site }) => ({ delegations: await listDelegations({ siteId: site.id }) }));

export const POST = siteRoute({ resource: "site", permission: "delegatePermits", body: delegationSchema }, async (ctx) =>
  created({ delegation: await delegateIssuing(ctx) }),
);
