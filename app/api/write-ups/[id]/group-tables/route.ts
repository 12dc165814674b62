import { saveGroupTables } from "@/db/queries/write-ups";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { groupTablesSaveSchema } from "@/lib/validation/write-ups";

export const PUT = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { revision, tables } = await readJson(req, groupTablesSaveSchema);
  return ok(saveGroupTables({ actor, writeUpId: id, revision, tables }));
});
