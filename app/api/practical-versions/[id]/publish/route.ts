import { z } from "zod";
import { publishVersion } from "@/db/queries/practicals";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

export const POST = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { revision } = await readJson(req, z.object({ revision: z.number().int().min(0) }));
  return ok(publishVersion({ actor, versionId: id, revision }));
});
