import { z } from "zod";

const key = z.string().regex(/^[A-Za-z0-9_:-]{1,60}$/, "A section reference is malformed.");

export const markSaveSchema = z.object({
  revision: z.number().int().min(0),
  criteria: z
    .record(
      z.string().regex(/^[A-Za-z0-9_-]{1,40}$/),
      z.object({
        levelId: z.string().regex(/^[A-Za-z0-9_-]{1,40}$/, "Choose a level."),
        overrideReason: z.string().trim().max(400, "Keep the reason under 400 characters.").nullable().optional(),
      }),
    )
    .default({}),
  comments: z.record(key, z.string().trim().max(1500, "A comment can be at most 1500 characters.")).default({}),
  feedback: z.string().trim().max(4000, "Feedback can be at most 4000 characters.").default(""),
});
export type MarkSaveInput = z.infer<typeof markSaveSchema>;

export const sampleRuleSchema = z.object({
  minCount: z.number().int().min(1, "At least one piece of work.").max(200),
  percent: z.number().min(1, "At least 1 %.").max(100, "At most 100 %."),
  includeExtremes: z.boolean(),
  everyMarker: z.boolean(),
});

export const drawSampleSchema = z
  .object({
    labSessionId: z.string().max(64).optional(),
    practicalId: z.string().max(64).optional(),
    moderatorId: z.string().min(1, "Choose a moderator.").max(64),
    rule: sampleRuleSchema.optional(),
    seed: z.number().int().min(0).max(2 ** 31 - 1).optional(),
    blind: z.boolean().default(true),
    toleranceMarks: z.number().int().min(0).max(50).default(1),
  })
  .refine((v) => !!v.labSessionId !== !!v.practicalId, { message: "Choose either one lab session or one practical.", path: ["labSessionId"] });

export const moderationMarkSchema = z.object({
  revision: z.number().int().min(0),
  criteria: z.record(z.string().regex(/^[A-Za-z0-9_-]{1,40}$/), z.object({ levelId: z.string().regex(/^[A-Za-z0-9_-]{1,40}$/, "Choose a level.") })),
  comment: z.string().trim().max(2000).default(""),
  complete: z.boolean().default(false),
});

export const sampleChangeSchema = z.discriminatedUnion("action", [
  z.object({ action: z.literal("add"), writeUpId: z.string().min(1).max(64), reason: z.string().trim().min(3, "Say why this work is added.").max(400) }),
  z.object({ action: z.literal("swap"), removeWriteUpId: z.string().min(1).max(64), writeUpId: z.string().min(1).max(64), reason: z.string().trim().min(3, "Say why this work is swapped.").max(400) }),
]);

export const adjustmentDecisionSchema = z.object({
  decision: z.enum(["accept", "reject"]),
  reason: z.string().trim().min(3, "Give a reason for the decision.").max(600),
});
