import { drawSample, listSamples } from "@/db/queries/moderation";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { drawSampleSchema } from "@/lib/validation/marking";

export const GET = handle(async () => {
  const actor = await requireApiRole("moderator", "admin");
  return ok({ samples: listSamples({ actor }) });
});

/** Draws a sample by the school's rule (or the rule sent), recording the seed. */
export const POST = handle(async (req) => {
  const actor = await requireApiRole("moderator", "admin");
  const input = await readJson(req, drawSampleSchema);
  return ok(drawSample({ actor, input }), { status: 201 });
});
