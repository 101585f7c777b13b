import { z } from "zod";
import { text } from "./text";
import { idSchema } from "./common";

/** True when the runtime's Intl knows the IANA zone (what the client formats times with). */
export function isKnownTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

export const storeNameSchema = text({ error: "must be text" })
  .trim()
  .min(1, "is required")
  .max(120, "must be at most 120 characters");
export const addressSchema = text({ error: "must be text" }).trim().max(300, "must be at most 300 characters");
export const timeZoneSchema = text({ error: "must be a time zone from the list, such as America/Chicago" })
  .trim()
  .min(1, "is required")
  .refine(isKnownTimeZone, {
    message: "is not a time zone we know: pick one from the list (such as America/Chicago or Europe/Berlin)",
  });

export const storeInput = z.object({
  name: storeNameSchema,
  address: addressSchema.default(""),
  timeZone: timeZoneSchema,
});
export type StoreInput = z.infer<typeof storeInput>;

export const storeUpdateInput = z
  .object({ name: storeNameSchema, address: addressSchema, timeZone: timeZoneSchema })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "name at least one of name, address, timeZone to change" });
export type StoreUpdateInput = z.infer<typeof storeUpdateInput>;

const booleanFlag = z
  .enum(["true", "false", "1", "0"], { error: "must be true or false" })
  .transform((v) => v === "true" || v === "1");

export const storeListQuery = z.object({
  search: text().trim().max(120, "must be at most 120 characters").optional(),
  sort: z.enum(["name", "created"], { error: "must be name or created" }).default("name"),
  order: z.enum(["asc", "desc"], { error: "must be asc or desc" }).default("asc"),
  includeArchived: booleanFlag.default(false),
});
export type StoreListQuery = z.infer<typeof storeListQuery>;

export const store = z.object({
  id: idSchema,
  name: text(),
  address: text(),
  timeZone: text(),
  archivedAt: text().nullable(),
  createdAt: text(),
  updatedAt: text(),
});
export type Store = z.infer<typeof store>;

export const storeListResponse = z.object({ stores: z.array(store) });
