import { z } from "zod";
import { text } from "./text";

// One error shape for every API failure. `fields` maps a dotted field path to its message.
export const apiErrorSchema = z.object({
  error: z.object({
    code: text(),
    message: text(),
    fields: z.record(text(), text()).optional(),
    details: z.record(text(), z.unknown()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

export const emailSchema = text()
  .trim()
  .toLowerCase()
  .max(254, "must be at most 254 characters")
  .pipe(z.email("must be a valid e-mail address"));
export const personNameSchema = text().trim().min(1, "is required").max(120, "must be at most 120 characters");
export const passwordSchema = text()
  .min(10, "must be at least 10 characters")
  .max(200, "must be at most 200 characters");
export const idSchema = z.uuid("must be a valid id");
