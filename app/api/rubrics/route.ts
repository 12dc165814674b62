import { createRubric, listRubrics } from "@/db/queries/rubrics";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { rubricBodySchema } from "@/lib/validation/practicals";

export const GET = handle(async () => {
  const actor = await requireApiUser();
  return ok({ rubrics: listRubrics({ actor }) });
});

export const POST = handle(async (req) => {
  const actor = await requireApiUser();
  const body = await readJson(req, rubricBodySchema);
  return ok({ id: createRubric({ actor, body }) }, { status: 201 });
});
