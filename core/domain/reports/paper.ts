import type { RuleProfile } from "../compliance/rule-profile";

export type Paper = "letter" | "a4";

/**
 * The paper a company's printed reports use: A4 (ISO 216) where it works under the EU F-gas
 * regulation, US Letter under US federal rules; a custom profile follows the one it was copied from.
 */
export function paperFor(profile: Pick<RuleProfile, "kind" | "basedOn">): Paper {
  const jurisdiction = profile.kind === "custom" ? profile.basedOn : profile.kind;
  return jurisdiction === "eu-fgas" ? "a4" : "letter";
}
