import { withReadableSources } from "./citations";
import { copyProfile } from "./custom-profile";
import { EU_FGAS_PROFILE } from "./eu-fgas-profile";
import type { RuleProfile } from "./rule-profile";
import { US_FEDERAL_PROFILE } from "./us-federal-profile";

export type CompanyRuleProfile = "us-federal" | "eu-fgas" | "custom";
export type BuiltInProfileId = "us-federal" | "eu-fgas";

export const BUILT_IN_PROFILES: Record<BuiltInProfileId, RuleProfile> = {
  "us-federal": US_FEDERAL_PROFILE,
  "eu-fgas": EU_FGAS_PROFILE,
};

/**
 * A fresh custom profile: an unedited copy of a built-in one, named after it. The company edits it
 * as its own document, so its sources read as citations rather than our internal tags.
 */
export function startCustomProfile(from: BuiltInProfileId): RuleProfile {
  const base = BUILT_IN_PROFILES[from];
  return withReadableSources(copyProfile(base, "custom", `Custom (from ${base.name})`));
}

/**
 * The rule profile a company setting names. "custom" uses the company's stored profile; a company
 * that chose "custom" before saving one works under an unedited copy of US federal.
 */
export function profileFor(setting: CompanyRuleProfile, custom: RuleProfile | null = null): RuleProfile {
  if (setting === "custom") return custom ?? startCustomProfile("us-federal");
  return BUILT_IN_PROFILES[setting];
}

/**
 * Whose words a profile's records and cautions use: "eu" for a profile with periodic leak checks and
 * no leak-rate parts (EU F-gas, or a custom copy of it), "us" otherwise.
 */
export function profileWording(profile: RuleProfile): "us" | "eu" {
  return profile.leakRateParts.length === 0 && profile.leakChecks ? "eu" : "us";
}

/** EU F-gas rules set leak checks, not a leak rate: a system's statement is named for what it holds. */
export function statementTitle(leakRateRules: boolean): string {
  return leakRateRules ? "Leak-rate statement" : "F-gas record statement";
}
