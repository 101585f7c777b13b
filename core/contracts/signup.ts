import { z } from "zod";
import { emailSchema, personNameSchema } from "./common";
import { newAccountPassword } from "./members";
import { text } from "./text";
import { numberFormatSchema } from "./units";

/** A new customer: the company, its first owner and the company's first settings. */
export const signUpInput = z.object({
  companyName: text().trim().min(1, "is required").max(120, "must be at most 120 characters"),
  name: personNameSchema,
  email: emailSchema,
  password: newAccountPassword,
  ruleProfile: z.enum(["us-federal", "eu-fgas"], { error: "must be US federal or EU F-gas" }),
  lengthUnit: z.enum(["m", "ft-in"], { error: "must be metres or feet and inches" }),
  massUnit: z.enum(["kg", "lb"], { error: "must be kg or lb" }),
  /** How the company writes numbers; changeable later in Company settings. */
  numberFormat: numberFormatSchema.default("1,234.5"),
});
export type SignUpInput = z.input<typeof signUpInput>;

export const confirmSignUpInput = z.object({
  token: text().min(20, "is not a valid confirmation link").max(200, "is not a valid confirmation link"),
});
