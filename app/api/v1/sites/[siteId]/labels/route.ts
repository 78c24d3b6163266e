// GET (the register's filters, ?start=) or POST { memberIds, start? } → a PDF sheet of QR tag labels,
// the first label in cell `start` (1–21) of a part-used sheet.
import { getMembersByIds, listMembers, type MemberListItem } from "@/db/queries/member-list";
import { siteRoute } from "@/lib/api/route";
import { env } from "@/lib/env";
import { renderLabelSheet } from "@/lib/pdf/labels";
import { ValidationError } from "@/lib/errors";
import { labelsRequestSchema, labelStartSchema, MAX_LABELS } from "@/lib/validations/labels";
import { memberListQuery } from "@/lib/register/member-query";

type Site = { id: string; name: string; code: string };

async function pdfResponse(site: Site, items: MemberListItem[], start: number) {
  const pdf = await renderLabelSheet({
    start,
    siteId: site.id,
    siteName: site.name,
    siteCode: site.code,
    appUrl: env.APP_URL,
    members: items.map((m) => ({ id: m.id, tag: m.tag, typeName: m.type.name, zoneName: m.zone?.name ?? null })),
  });
  const name = `${site.code}-labels-${items.length}.pdf`.replace(/[^A-Za-z0-9._-]/g, "_");
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `inline; filename="${name}"`,
      "cache-control": "private, no-store",
    },
  });
}

export const GET = siteRoute({ resource: "site", permission: "viewSite", query: memberListQuery({ wholeSet: true, extra: { start: labelStartSchema } }) }, async ({ site, query }) => {
  const { sort, dir, filters, start } = query;
  const page = await listMembers({ siteId: site.id, filters, sort, dir, limit: MAX_LABELS });
  if (page.items.length === 0) throw new ValidationError({ _: "No member matches these filters, so there is no label to print." }, "No member matches these filters.");
  if (page.nextCursor)
    throw new ValidationError(
      { _: `${page.total ?? "More than " + MAX_LABELS} members match; a sheet holds at most ${MAX_LABELS} labels. Narrow the filters or choose members.` },
      `Too many members for one label sheet (at most ${MAX_LABELS}).`,
    );
  return pdfResponse(site, page.items, start);
});

export const POST = siteRoute({ resource: "site", permission: "viewSite", body: labelsRequestSchema }, async ({ site, input }) => {
  const ids = [...new Set(input.memberIds)];
  const items = await getMembersByIds({ siteId: site.id, ids });
  if (items.length !== ids.length) {
    const missing = ids.length - items.length;
    throw new ValidationError({
      memberIds: `${missing} of the chosen member${missing === 1 ? " is" : "s are"} not on this site's register (deleted, or from another site).`,
    });
  }
  return pdfResponse(site, items, input.start);
});
