// GET /api/v1/sites/{siteId}/members/export.csv?(the register's filters and sort) → every matching
// member as CSV, streamed a thousand rows at a time (not just the page on screen).
import { iterateMembers } from "@/db/queries/member-list";
import { siteRoute } from "@/lib/api/route";
import { csvHeader, csvRows } from "@/lib/register/members-csv";
import { memberListQuery } from "@/lib/register/member-query";

// Export is always everything the filters show, whatever page the screen was on.
export const GET = siteRoute({ resource: "site", permission: "viewSite", query: memberListQuery({ wholeSet: true }) }, async ({ site, query }) => {
  const { sort, dir, filters } = query;

  const batches = iterateMembers({ siteId: site.id, filters, sort, dir, batchSize: 1000 });
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      // A byte-order mark so spreadsheet programs read the file as UTF-8 (zone names have dashes).
      controller.enqueue(encoder.encode(`\uFEFF${csvHeader()}`));
    },
    async pull(controller) {
      try {
        const next = await batches.next();
        if (next.done) controller.close();
        else controller.enqueue(encoder.encode(csvRows(next.value)));
      } catch (e) {
        console.error("[export] failed while streaming", site.id, e);
        controller.error(e);
      }
    },
    async cancel() {
      await batches.return(undefined);
    },
  });
  const day = new Date().toISOString().slice(0, 10);
  const name = `${site.code}-register-${day}.csv`.replace(/[^A-Za-z0-9._-]/g, "_");
  return new Response(stream, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "private, no-store",
    },
  });
});
