import { z } from "zod";
import { getRubric, updateRubric } from "@/db/queries/rubrics";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { rubricBodySchema } from "@/lib/validation/practicals";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(getRubric({ actor, rubricId: id }));
});

export const PATCH = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const input = await readJson(req, z.object({ revision: z.number().int().min(0), body: rubricBodySchema.optional(), archived: z.boolean().optional() }));
  return ok(updateRubric({ actor, rubricId: id, ...input }));
});
