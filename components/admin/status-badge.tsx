import { Badge, type Tone } from "@/components/ui/badge";
import type { PersonStatus } from "./api-types";

export const STATUS_LABELS: Record<PersonStatus, string> = {
  active: "Set up",
  invited: "Invited",
  "not-invited": "Not invited",
  deactivated: "Deactivated",
};

const STATUS_TONES: Record<PersonStatus, Tone> = { active: "good", invited: "brand", "not-invited": "warn", deactivated: "neutral" };

/** Where a person's account stands, always in words. */
export function StatusBadge({ status }: { status: PersonStatus }) {
  return <Badge tone={STATUS_TONES[status]}>{STATUS_LABELS[status]}</Badge>;
}
