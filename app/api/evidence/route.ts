import { z } from "zod";
import { createUpload, listEvidence } from "@/db/queries/evidence";
import { handle, ok, readJson, readQuery } from "@/lib/api";
import { requireApiUser } from "@/lib/auth/guards";
import { uploadRequestSchema } from "@/lib/validation/evidence";

const targetSchema = z
  .object({ writeUpId: z.string().min(1).max(64).optional(), practicalId: z.string().min(1).max(64).optional() })
  .refine((v) => !!v.writeUpId !== !!v.practicalId, { message: "Give a writeUpId or a practicalId." });

/** Photos of a write-up or practical, with links that expire in minutes. */
export const GET = handle(async (req) => {
  const actor = await requireApiUser();
  const q = readQuery(req, targetSchema);
  return ok({ photos: await listEvidence({ actor, target: q.writeUpId ? { writeUpId: q.writeUpId } : { practicalId: q.practicalId! } }) });
});

/** Starts an upload and returns the presigned URL the browser sends the file to. */
export const POST = handle(async (req) => {
  const actor = await requireApiUser();
  const input = await readJson(req, uploadRequestSchema);
  const target = input.writeUpId ? { writeUpId: input.writeUpId } : { practicalId: input.practicalId! };
  return ok(await createUpload({ actor, target, filename: input.filename, contentType: input.contentType, size: input.size, caption: input.caption }), { status: 201 });
});
