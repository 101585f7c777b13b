import type { RuleProfile } from "../compliance/rule-profile";

export type Paper = "letter" | "a4";

/** The company's paper setting: a size, or "profile" to follow the rule profile (the default). */
export const PAPER_SETTINGS = ["profile", "letter", "a4"] as const;
export type PaperSetting = (typeof PAPER_SETTINGS)[number];

/**
 * The paper a company's printed reports use: A4 (ISO 216) where it works under the EU F-gas
 * regulation, US Letter under US federal rules; a custom profile follows the one it was copied from.
 */
export function paperFor(profile: Pick<RuleProfile, "kind" | "basedOn">): Paper {
  const jurisdiction = profile.kind === "custom" ? profile.basedOn : profile.kind;
  return jurisdiction === "eu-fgas" ? "a4" : "letter";
}

/** The paper every PDF prints on: the company's chosen size, or the profile's when it follows the profile. */
export function reportPaper(setting: PaperSetting, profile: Pick<RuleProfile, "kind" | "basedOn">): Paper {
  return setting === "profile" ? paperFor(profile) : setting;
}

/** Page size in PDF points: ISO 216 A4 is 210 × 297 mm; US Letter is 8.5 × 11 in (72 pt to the inch). */
export const PAPER_POINTS: Record<Paper, { width: number; height: number }> = {
  a4: { width: 595.28, height: 841.89 },
  letter: { width: 612, height: 792 },
};
