import type { Metadata } from "next";
import { PeopleDirectory } from "@/components/admin/people-directory";
import { requirePageRole } from "@/lib/auth/guards";
import { PERSON_STATUSES } from "@/lib/validation/users";
import { ROLES, type Role } from "@/lib/roles";

export const metadata: Metadata = { title: "People" };

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) ?? "";

export default async function PeoplePage({ searchParams }: PageProps<"/admin/people">) {
  await requirePageRole(["admin"], "/admin/people");
  const sp = await searchParams;
  const role = first(sp.role);
  const status = first(sp.status);
  return (
    <PeopleDirectory
      initial={{
        role: (ROLES as readonly string[]).includes(role) ? (role as Role) : "",
        status: (PERSON_STATUSES as readonly string[]).includes(status) ? status : "",
        q: first(sp.q).slice(0, 100),
      }}
    />
  );
}
