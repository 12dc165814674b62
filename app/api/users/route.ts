import { sendInvitationsTo } from "@/db/queries/invitations";
import { createUser, listUsers, type UserListItem } from "@/db/queries/users";
import { handle, ok, readJson, readQuery } from "@/lib/api";
import { requireApiRole } from "@/lib/auth/guards";
import { peopleQuerySchema, userCreateSchema, type PersonStatus } from "@/lib/validation/users";

function matchesStatus(status: UserListItem["status"], wanted: PersonStatus | undefined): boolean {
  if (!wanted) return true;
  if (wanted === "not-set-up") return status === "invited" || status === "not-invited";
  return status === wanted;
}

/** Everyone in the school, filtered by role, account status and a search on name or e-mail. */
export const GET = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { role, status, q } = readQuery(req, peopleQuerySchema);
  const people = listUsers({ actor, role, search: q })
    .filter((p) => matchesStatus(p.status, status))
    .map((p) => ({ id: p.id, name: p.name, email: p.email, roles: p.roles, yearGroup: p.yearGroup, status: p.status, lastSignInAt: p.lastSignInAt }));
  return ok({ people });
});

/** Adds a person; with sendInvitation, also e-mails them a link to choose a password. */
export const POST = handle(async (req) => {
  const actor = await requireApiRole("admin");
  const { sendInvitation, ...input } = await readJson(req, userCreateSchema);
  const id = createUser({ actor, input });
  let invitation: { sent: true; expiresAt: Date } | { sent: false; message: string } | null = null;
  if (sendInvitation) {
    const [attempt] = await sendInvitationsTo({ actor, userIds: [id] });
    invitation = attempt!.ok ? { sent: true, expiresAt: attempt!.expiresAt } : { sent: false, message: attempt!.message };
  }
  return ok({ id, invitation }, { status: 201 });
});
