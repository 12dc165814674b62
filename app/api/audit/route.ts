import { auditNames, listAudit, listAuditEntityTypes } from "@/db/queries/audit";
import { handle, ok, readQuery } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { auditQuerySchema } from "@/lib/validation/admin";

/** Ids an entry mentions: the record itself and any `…Id` / `…Ids` values in before and after. */
function mentionedIds(value: unknown, into: string[]): void {
  if (!value || typeof value !== "object" || Array.isArray(value)) return;
  for (const [key, v] of Object.entries(value as Record<string, unknown>)) {
    if (/Id$/.test(key) && typeof v === "string") into.push(v);
    if (/Ids$/.test(key) && Array.isArray(v)) for (const x of v) if (typeof x === "string") into.push(x);
  }
}

/** The school's audit trail, newest first, with display names for the people and classes it mentions. */
export const GET = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { entityType, entityId, limit } = readQuery(req, auditQuerySchema);
  const entries = listAudit({ actor, entityType, entityId, limit: limit + 1 });
  const page = entries.slice(0, limit);
  const ids: string[] = [];
  for (const e of page) {
    ids.push(e.entityId);
    mentionedIds(e.before, ids);
    mentionedIds(e.after, ids);
  }
  return ok({
    entries: page,
    hasMore: entries.length > limit,
    names: auditNames({ actor, ids }),
    entityTypes: listAuditEntityTypes({ actor }),
  });
});
