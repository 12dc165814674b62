import { z } from "zod";
import { listLabSessions, scheduleLabSession } from "@/db/queries/lab-sessions";
import { handle, ok, readJson, readQuery } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { labSessionSchema } from "@/lib/validation/practicals";

export const GET = handle(async (req) => {
  const actor = await requireApiUser();
  const q = readQuery(req, z.object({ classId: z.string().max(64).optional() }));
  return ok({ labSessions: listLabSessions({ actor, classId: q.classId }) });
});

export const POST = handle(async (req) => {
  const actor = await requireApiUser();
  const input = await readJson(req, labSessionSchema);
  return ok({ id: scheduleLabSession({ actor, input }) }, { status: 201 });
});
