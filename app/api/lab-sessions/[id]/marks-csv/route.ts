import { exportMarksCsv } from "@/db/queries/marking";
import { handle } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

/** The class's marks as a CSV download (cells that look like formulas are made safe). */
export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("teacher", "admin");
  const { id } = await ctx.params;
  const { filename, csv } = exportMarksCsv({ actor, labSessionId: id });
  return new Response(`\uFEFF${csv}`, {
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${filename}"`, "cache-control": "no-store" },
  });
});
