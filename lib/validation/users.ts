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
