import { z } from "zod";
import { emailSchema, idSchema, personNameSchema, yearGroupSchema } from "./common";

export const classBaseSchema = z.object({
  name: z.string().trim().min(1, "Give the class a name, like 10C Chemistry.").max(80, "A class name can be at most 80 characters."),
  subject: z.string().trim().min(1, "Enter the subject.").max(60, "A subject can be at most 60 characters."),
  yearGroup: yearGroupSchema,
  academicYear: z
    .string()
    .trim()
    .regex(/^\d{4}-\d{2}$/, "Write the academic year like 2026-27.")
    .refine((v) => Number(v.slice(5)) === (Number(v.slice(2, 4)) + 1) % 100, "The second year must follow the first, like 2026-27."),
  teacherIds: z.array(idSchema).max(10, "A class can have at most 10 teachers.").default([]),
});
export const classCreateSchema = classBaseSchema;
export type ClassCreateInput = z.infer<typeof classCreateSchema>;

export const classUpdateSchema = classBaseSchema.partial().extend({ archived: z.boolean().optional() });
export type ClassUpdateInput = z.infer<typeof classUpdateSchema>;

export const enrolSchema = z.object({
  studentIds: z.array(idSchema).min(1, "Choose at least one student.").max(200),
});

export const parentLinkSchema = z.object({
  parentId: idSchema,
  studentId: idSchema,
  relationship: z.string().trim().min(1).max(40, "Keep the relationship short, like Mother or Guardian.").default("Parent"),
});

/** A spreadsheet cell that is empty or holds only spaces counts as not given. */
const blankToUndefined = (v: unknown) => (v == null || (typeof v === "string" && v.trim() === "") ? undefined : v);

/** One row of a roster CSV, after the header names have been matched. */
export const rosterRowSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  yearGroup: z.preprocess(blankToUndefined, yearGroupSchema.optional()),
  parentName: z.preprocess(blankToUndefined, personNameSchema.optional()),
  parentEmail: z.preprocess(blankToUndefined, emailSchema.optional()),
  relationship: z.preprocess(
    (v) => (v === "" || v == null ? undefined : v),
    z.string().trim().max(40, "Keep the relationship short, like Mother or Guardian.").optional(),
  ),
});
export type RosterRow = z.infer<typeof rosterRowSchema>;

export const rosterImportSchema = z.object({
  csv: z.string().min(1, "The file is empty.").max(512_000, "The file is too large: a roster can be at most 500 kB."),
  commit: z.boolean().default(false),
  sendInvitations: z.boolean().default(true),
});

/**
 * A class change from the admin screens. Unlike `classUpdateSchema`, leaving out `teacherIds`
 * leaves the teachers as they are (the base schema's default of [] would remove them all).
 */
export const classPatchSchema = classBaseSchema
  .omit({ teacherIds: true })
  .partial()
  .extend({
    teacherIds: z.array(idSchema).max(10, "A class can have at most 10 teachers.").optional(),
    archived: z.boolean().optional(),
  });
export type ClassPatchInput = z.infer<typeof classPatchSchema>;

export const familyUnlinkSchema = parentLinkSchema.pick({ parentId: true, studentId: true });

/** Largest roster file accepted, in characters; anything bigger is refused as too large (413). */
export const ROSTER_MAX_CSV_CHARS = 512_000;

/** The roster request as sent over HTTP; the route checks the size so it can answer 413. */
export const rosterRequestSchema = rosterImportSchema.extend({
  csv: z.string({ error: "Send the roster as text in the csv field." }).min(1, "The file is empty."),
});
