import { readableSource, UNCONFIRMED } from "./citations";
import type { RuleProfile } from "./rule-profile";

export interface Reading {
  /** What the product does, in plain words. */
  text: string;
  /** Where it is set: a value of the profile, or how the product reads a rule. */
  kind: "profile-value" | "product-reading";
  /** The decision record that explains a product reading. */
  decision?: string;
}

/**
 * How the product applies rules whose text it has not confirmed: the product's own readings,
 * recorded as decisions (docs/decisions/), then every value of the profile marked from memory
 * ("[M]"). Each is listed once, for the owner to accept or change (a custom profile changes values).
 */
export const PRODUCT_READINGS: readonly Reading[] = [
  {
    kind: "product-reading",
    text: "The 30 days to repair run from the first leak rate above the threshold; a later one before the repair does not extend them.",
    decision: "docs/decisions/0041-repair-clock.md",
  },
  {
    kind: "product-reading",
    text: "Refrigerant added for the same leak before its repair is one leak-rate calculation, counted from the addition before it.",
    decision: "docs/decisions/0042-same-leak-additions.md",
  },
  {
    kind: "product-reading",
    text: "After a retrofit, the next leak rate counts its days from the retrofit fill; without a recorded fill it uses 365 days.",
    decision: "docs/decisions/0043-system-revisions.md",
  },
  {
    kind: "product-reading",
    text: "When a repair does not hold (the follow-up verification test fails, or no repair within the deadline), a retrofit-or-retire plan falls due.",
    decision: "docs/decisions/0044-readings-and-research-notes.md",
  },
];

const sourcesOf = (node: unknown): string[] =>
  node && typeof node === "object"
    ? Object.entries(node).flatMap(([k, v]) => (k === "source" && typeof v === "string" ? [v] : sourcesOf(v)))
    : [];

const MARKER = new RegExp(`\\s*\\((?:${UNCONFIRMED})\\)|;?\\s*${UNCONFIRMED}(?=\\))`, "g");

/**
 * The reading a figure's source stands on, in the words the rule-profile page lists it: the source
 * as people read it without its "reading" marker. Null when the source is no reading (nothing [M]).
 */
export function readingTextOf(source: string): string | null {
  if (!source.includes("[M]")) return null;
  const text = readableSource(source)
    .replace(MARKER, "")
    .replace(/\(\s*\)/g, "")
    .trim();
  return text || null;
}

export function profileReadings(profile: RuleProfile): Reading[] {
  const seen = new Set<string>();
  const values: Reading[] = [];
  for (const source of sourcesOf(profile)) {
    const text = readingTextOf(source);
    if (!text || seen.has(text)) continue;
    seen.add(text);
    values.push({ kind: "profile-value", text });
  }
  return [...PRODUCT_READINGS, ...values];
}

// "(reading)" or "(40 CFR 84.106; reading)": the marker stands alone inside a citation's brackets.
const STANDALONE_MARKER = new RegExp(`(?<=[(;] ?)${UNCONFIRMED}(?=[;)])`, "g");

/**
 * A rule source as a printed page reads it: the citation, with each "reading" marker saying whether
 * the owner has accepted the reading behind it ("reading, accepted" / "reading, not accepted"), as the
 * screens do (docs/decisions/0048-accepting-readings.md). `accepted` null: the markers stay plain.
 */
export function citedWithAcceptance(source: string, accepted: ReadonlySet<string> | null): string {
  const cited = readableSource(source);
  const reading = accepted ? readingTextOf(source) : null;
  if (reading === null) return cited;
  return cited.replace(STANDALONE_MARKER, `${UNCONFIRMED}, ${accepted!.has(reading) ? "accepted" : "not accepted"}`);
}
