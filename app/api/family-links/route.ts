import { linkParent, unlinkParent } from "@/db/queries/family";
import { handle, ok, readJson } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { familyUnlinkSchema, parentLinkSchema } from "@/lib/validation/classes";

/** Links a parent or guardian to a student, with the relationship (Mother, Guardian, …). */
export const POST = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { parentId, studentId, relationship } = await readJson(req, parentLinkSchema);
  linkParent({ actor, parentId, studentId, relationship });
  return ok({ linked: true }, { status: 201 });
});

/** Removes a family link; both accounts stay. */
export const DELETE = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { parentId, studentId } = await readJson(req, familyUnlinkSchema);
  unlinkParent({ actor, parentId, studentId });
  return ok({ unlinked: true });
});
