import { z } from "zod";
import { getPracticalDetail, setPracticalArchived } from "@/db/queries/practicals";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";

export const GET = handle<{ id: string }>(async (_req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  return ok(getPracticalDetail({ actor, practicalId: id }));
});

export const PATCH = handle<{ id: string }>(async (req, ctx) => {
  const actor = await requireApiUser();
  const { id } = await ctx.params;
  const { archived } = await readJson(req, z.object({ archived: z.boolean() }));
  setPracticalArchived({ actor, practicalId: id, archived });
  return ok(getPracticalDetail({ actor, practicalId: id }));
});
