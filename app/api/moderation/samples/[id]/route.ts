import { z } from "zod";
import { completeSample, getSample } from "@/db/queries/moderation";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiRole("moderator", "admin");
  const { id } = await ctx.params;
  return ok(getSample({ actor, sampleId: id }));
});

export const PATCH = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiRole("moderator", "admin");
  const { id } = await ctx.params;
  await readJson(req, z.object({ status: z.literal("completed") }));
  completeSample({ actor, sampleId: id });
  return ok(getSample({ actor, sampleId: id }));
});
