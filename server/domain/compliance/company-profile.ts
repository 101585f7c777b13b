import { copyProfile } from "./custom-profile";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import type { RuleProfile } from "./rule-profile";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

export type CompanyRuleProfile = "us-federal" | "eu-fgas" | "custom";

// Until custom profiles are stored per company, "custom" is an unedited copy of the US federal
// profile (the same starting point the GWP display uses, server/api/systems/refrigerant-summary.ts).
const CUSTOM = copyProfile(US_FEDERAL_PROFILE, "custom", "Custom (starts as a copy of US federal)");

/** The rule profile a company setting names. */
export function profileFor(setting: CompanyRuleProfile): RuleProfile {
  return setting === "eu-fgas" ? EU_FGAS_PROFILE : setting === "custom" ? CUSTOM : US_FEDERAL_PROFILE;
}
