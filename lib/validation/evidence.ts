import { z } from "zod";

const caption = z.string().trim().max(200, "A caption can be at most 200 characters.").default("");

export const uploadRequestSchema = z
  .object({
    writeUpId: z.string().min(1).max(64).optional(),
    practicalId: z.string().min(1).max(64).optional(),
    filename: z.string().trim().min(1, "The file needs a name.").max(255, "The file name is too long."),
    contentType: z.string().trim().max(100),
    size: z.number().int("The size must be a whole number of bytes.").min(1, "The file is empty.").max(1_000_000_000, "The file is far too large."),
    caption,
  })
  .refine((v) => !!v.writeUpId !== !!v.practicalId, { message: "Say whether the photo is for a write-up or a practical.", path: ["writeUpId"] });

export const captionSchema = z.object({ caption });
