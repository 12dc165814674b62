import { z } from "zod";
import { createPractical, listPracticals, listTopics } from "@/db/queries/practicals";
import { handle, ok, readJson, readQuery } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { practicalCreateSchema } from "@/lib/validation/practicals";

const querySchema = z.object({
  search: z.string().max(100).optional(),
  topic: z.string().max(60).optional(),
  yearGroup: z.coerce.number().int().min(7).max(13).optional(),
  archived: z.enum(["true", "false"]).optional(),
});

export const GET = handle(async (req) => {
  const actor = await requireApiUser();
  const q = readQuery(req, querySchema);
  return ok({ practicals: listPracticals({ actor, search: q.search, topic: q.topic, yearGroup: q.yearGroup, archived: q.archived === "true" }), topics: listTopics({ actor }) });
});

export const POST = handle(async (req) => {
  const actor = await requireApiUser();
  const input = await readJson(req, practicalCreateSchema);
  return ok(createPractical({ actor, input }), { status: 201 });
});
