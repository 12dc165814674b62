import { termReportFor } from "@/db/queries/progress";
import { handle } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

/** The term report as a PDF download. */
export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { pdf, filename } = await termReportFor({ actor, studentId: id });
  return new Response(new Uint8Array(pdf), {
    headers: { "content-type": "application/pdf", "content-disposition": `attachment; filename="${filename}"`, "cache-control": "private, no-store" },
  });
});
