import { z } from "zod";
import { submitWriteUp } from "@/db/queries/write-ups";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

export const POST = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { revision } = await readJson(req, z.object({ revision: z.number().int().min(0) }));
  return ok(submitWriteUp({ actor, writeUpId: id, revision }));
});
