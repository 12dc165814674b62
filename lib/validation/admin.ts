import { z } from "zod";
import { idSchema } from "./common";

const blankToUndefined = (v: unknown) => (v === "" || v == null ? undefined : v);

/** Query string of the outbox: ?to=part-of-an-address */
export const outboxQuerySchema = z.object({
  to: z.preprocess(blankToUndefined, z.string().trim().max(254, "Search for at most 254 characters.").optional()),
});

/** Query string of the audit trail: ?entityType=user&entityId=…&limit=200 */
export const auditQuerySchema = z.object({
  entityType: z.preprocess(
    blankToUndefined,
    z
      .string()
      .trim()
      .max(40, "That kind of record is not known.")
      .regex(/^[a-z][a-z0-9-]*$/, "That kind of record is not known.")
      .optional(),
  ),
  entityId: z.preprocess(blankToUndefined, idSchema.optional()),
  limit: z.preprocess(blankToUndefined, z.coerce.number({ error: "Limit must be a number." }).int("Limit must be a whole number.").min(1).max(1000).default(200)),
});

/** Query string of the class list: ?archived=include */
export const classesQuerySchema = z.object({
  archived: z.preprocess(blankToUndefined, z.enum(["include", "exclude"], { error: "archived must be include or exclude." }).default("exclude")),
});
