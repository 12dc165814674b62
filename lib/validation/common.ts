import { z } from "zod";
import { ROLES } from "@/lib/roles";

export const idSchema = z.string().trim().min(1, "An id is required.").max(64, "That id is too long.");

export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .toLowerCase()
  .max(254, "An e-mail address can be at most 254 characters.")
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@school.example." }));

export const personNameSchema = z
  .string({ error: "Enter a name." })
  .trim()
  .min(1, "Enter a name.")
  .max(120, "A name can be at most 120 characters.");

export const roleSchema = z.enum(ROLES, {
  error: (issue) => `"${String(issue.input)}" is not a role. Use one of: ${ROLES.join(", ")}.`,
});

export const yearGroupSchema = z.coerce
  .number({ error: "Year group must be a whole number from 1 to 13." })
  .int("Year group must be a whole number from 1 to 13.")
  .min(1, "Year group must be a whole number from 1 to 13.")
  .max(13, "Year group must be a whole number from 1 to 13.");

export const passwordSchema = z
  .string({ error: "Enter a password." })
  .min(10, "Use at least 10 characters for your password.")
  .max(200, "A password can be at most 200 characters.");

/** Turns zod issues into the `{ field: [messages] }` shape every form and API error uses. */
export function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_form";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}
