import { z } from "zod";
import { classProgressCsv, getClassProgress } from "@/db/queries/progress";
import { handle, ok, readQuery } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

/** A class's progress across practicals (teachers of the class, admins); ?format=csv downloads it. */
export const GET = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiRole("teacher", "admin");
  const { id } = await ctx.params;
  const { format } = readQuery(req, z.object({ format: z.enum(["json", "csv"]).default("json") }));
  if (format === "csv") {
    const { filename, csv } = classProgressCsv({ actor, classId: id });
    return new Response(`\uFEFF${csv}`, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${filename}"`, "cache-control": "no-store" } });
  }
  return ok(getClassProgress({ actor, classId: id }));
});
