import { z } from "zod";
import { emailSchema, passwordSchema, personNameSchema, roleSchema, yearGroupSchema } from "./common";

export const userBaseSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  roles: z.array(roleSchema).min(1, "Choose at least one role.").max(5),
  yearGroup: yearGroupSchema.nullable().optional(),
});

export const userCreateSchema = userBaseSchema.extend({
  sendInvitation: z.boolean().default(true),
});
export type UserCreateInput = z.infer<typeof userCreateSchema>;

export const userUpdateSchema = userBaseSchema.partial().extend({
  active: z.boolean().optional(),
  emailNotifications: z.boolean().optional(),
});
export type UserUpdateInput = z.infer<typeof userUpdateSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "Enter your password.").max(200, "A password can be at most 200 characters."),
});

export const newPasswordSchema = z
  .object({
    token: z.string().trim().min(20, "This link is incomplete. Copy the whole link from the e-mail.").max(200),
    password: passwordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords do not match." });
export type NewPasswordInput = z.infer<typeof newPasswordSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const changePasswordSchema = z
  .object({
    current: z.string().min(1, "Enter your current password.").max(200),
    password: passwordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords do not match." });

export const preferencesSchema = z.object({ emailNotifications: z.boolean() });

/** How far a person has got with their account, as the people list filters it. */
export const PERSON_STATUSES = ["active", "invited", "not-invited", "not-set-up", "deactivated"] as const;
export type PersonStatus = (typeof PERSON_STATUSES)[number];

const blankToUndefined = (v: unknown) => (v === "" || v == null ? undefined : v);

/** Query string of the people list: ?role=student&status=not-set-up&q=ellis */
export const peopleQuerySchema = z.object({
  role: z.preprocess(blankToUndefined, roleSchema.optional()),
  status: z.preprocess(
    blankToUndefined,
    z.enum(PERSON_STATUSES, { error: `Status must be one of: ${PERSON_STATUSES.join(", ")}.` }).optional(),
  ),
  q: z.preprocess(blankToUndefined, z.string().trim().max(100, "Search for at most 100 characters.").optional()),
});

/** Query string of the people picker: one role, an optional search term. */
export const pickerQuerySchema = z.object({
  role: roleSchema,
  q: z.preprocess(blankToUndefined, z.string().trim().max(100, "Search for at most 100 characters.").optional()),
  limit: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(500).default(25)),
});
