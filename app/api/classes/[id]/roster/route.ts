import { sendInvitationsTo } from "@/db/queries/invitations";
import { importRoster, previewRoster } from "@/db/queries/roster";
import { describePeople } from "@/db/queries/users";
import { handle, ok, readJson, type RouteContext } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { AppError } from "@/lib/errors";
import { ROSTER_MAX_CSV_CHARS, rosterRequestSchema } from "@/lib/validation/classes";

type Params = { id: string };

/**
 * Roster CSV. commit=false: says row by row what an import would do, writing nothing.
 * commit=true: imports every row or none (any bad row refuses the file with the preview), then,
 * if asked, invites the people it created. A mail failure is reported but never undoes the import.
 */
export const POST = handle<Params>(async (req, ctx: RouteContext<Params>) => {
  const actor = await requireApiRole("admin");
  const { id } = await ctx.params;
  const { csv, commit, sendInvitations } = await readJson(req, rosterRequestSchema);
  if (csv.length > ROSTER_MAX_CSV_CHARS) {
    throw new AppError("payload_too_large", `The file is too large: a roster can be at most ${Math.round(ROSTER_MAX_CSV_CHARS / 1000)} kB. Split it into smaller files.`);
  }
  if (!commit) return ok({ preview: previewRoster({ actor, classId: id, csv }) });

  const result = importRoster({ actor, classId: id, csv });
  const created = describePeople({ actor, userIds: result.created });
  const attempts = sendInvitations && created.length ? await sendInvitationsTo({ actor, userIds: created.map((p) => p.id) }) : [];
  const byId = new Map(created.map((p) => [p.id, p]));
  return ok({
    imported: {
      rows: result.rows,
      enrolled: result.enrolled,
      created: created.map((p) => ({ id: p.id, name: p.name, email: p.email, roles: p.roles })),
    },
    invitations: {
      requested: sendInvitations,
      sent: attempts.filter((a) => a.ok).length,
      failed: attempts.flatMap((a) => (a.ok ? [] : [{ id: a.userId, name: byId.get(a.userId)?.name ?? "", email: byId.get(a.userId)?.email ?? "", message: a.message }])),
    },
  });
});
