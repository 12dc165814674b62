import type { Metadata } from "next";
import { ModerationHome } from "@/components/moderation/moderation-home";
import { hasRole } from "@/lib/auth/actor";
import { requirePageRole } from "@/lib/auth/guards";

export const metadata: Metadata = { title: "Moderation" };

export default async function ModerationPage() {
  const actor = await requirePageRole(["moderator", "admin"], "/moderation");
  return <ModerationHome me={{ id: actor.userId, name: actor.name, admin: hasRole(actor, "admin"), moderator: hasRole(actor, "moderator") }} />;
}
