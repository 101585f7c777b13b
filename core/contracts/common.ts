import { z } from "zod";

// One error shape for every API failure. `fields` maps a dotted field path to its message.
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    details: z.record(z.string(), z.unknown()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, "must be at most 254 characters")
  .pipe(z.email("must be a valid e-mail address"));
export const personNameSchema = z.string().trim().min(1, "is required").max(120, "must be at most 120 characters");
export const passwordSchema = z
  .string()
  .min(10, "must be at least 10 characters")
  .max(200, "must be at most 200 characters");
export const idSchema = z.uuid("must be a valid id");
