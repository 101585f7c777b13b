/**
 * Rule data carries internal source tags ("[S:R4]" confirmed in source R4 of our reference list,
 * "[M]" from memory, "[D]" derived). People reading a screen, a PDF or an e-mail need the citation
 * instead: "40 CFR 84.106", "Regulation (EU) 2024/573, Art. 7". The tags stay in the data, the
 * tests and the CSV export for auditors of the data itself; every reader-facing text goes
 * through `readableSource`.
 */

interface Citation {
  /** How the source reads for a person. */
  text: string;
  /** Already said when the text mentions this (no need to repeat the citation). */
  mentioned: RegExp;
}

const CFR82 = /40 CFR 82|\b82\.1\d\d/;
const CFR84 = /40 CFR 84|\b84\.1\d\d/;

/** Our reference list (docs/reference/standards.md "Sources") as readable citations; secondary summaries name the rule they summarise. */
export const CITATIONS: Record<string, Citation> = {
  R1: { text: "40 CFR 82.157", mentioned: CFR82 },
  R2: { text: "85 FR 14150 (2020)", mentioned: /85 FR 14150/ },
  R3: { text: "89 FR 82682 (2024)", mentioned: /89 FR 82682/ },
  R4: { text: "40 CFR 84 subpart C", mentioned: CFR84 },
  R4b: { text: "90 FR 47999 (2025, proposed)", mentioned: /90 FR 47999/ },
  R5: { text: "40 CFR 84.102", mentioned: /84\.102/ },
  // Secondary summaries (a trade magazine, a study guide, a legal digest) are research notes: a reader
  // sees only the rule they summarise.
  R6: { text: "40 CFR 82 subpart F", mentioned: CFR82 },
  R7: { text: "40 CFR 82 subpart F and 84 subpart C", mentioned: /82 subpart F and 84|40 CFR 8[24]\.1\d\d/ },
  R8: { text: "40 CFR 82.152", mentioned: /82\.152/ },
  R9: { text: "EPA Section 608 technician certification", mentioned: /Section 608/ },
  E1: { text: "Regulation (EU) No 517/2014, Art. 4", mentioned: /517\/2014 Art/ },
  E2: { text: "Regulation (EU) No 517/2014, Art. 5", mentioned: /517\/2014 Art\. 5/ },
  E3: { text: "Regulation (EU) No 517/2014, Annex I (IPCC AR4 values)", mentioned: /Annex I\b/ },
  E4: { text: "Regulation (EU) 2024/573, Art. 3 and Annexes I–VI", mentioned: /2024\/573, Annex/ },
  E5: { text: "Regulation (EU) 2024/573, Art. 5", mentioned: /2024\/573 Art\. 5/ },
  E6: { text: "Regulation (EU) 2024/573", mentioned: /2024\/573/ },
  E7: { text: "Regulation (EU) 2024/573, Art. 3 (CO2 equivalent)", mentioned: /CO2 equivalent/ },
  E8: { text: "Regulation (EC) No 1516/2007", mentioned: /1516\/2007/ },
  E8b: { text: "Regulation (EU) 2024/573, Art. 7", mentioned: /2024\/573 Art\. 7/ },
  G1: { text: "IPCC GWP-100 tables (AR4/AR5/AR6)", mentioned: /IPCC/ },
  G2: { text: "IPCC AR4, p. 212", mentioned: /IPCC AR4/ },
  G3: { text: "ASHRAE 34-2019 blend compositions", mentioned: /ASHRAE 34/ },
  S1: { text: "IMC Table 1103.1 (from ASHRAE 34)", mentioned: /IMC/ },
  S2: { text: "OSHA PEL preamble (1989)", mentioned: /OSHA/ },
  S2b: { text: "NIOSH criteria document for CO2 (1976)", mentioned: /NIOSH/ },
  D1: { text: "SAE J2791", mentioned: /J2791/ },
  D2: { text: "EN 14624:2020 and EN 50676", mentioned: /EN 14624|EN 50676/ },
  D3: { text: "common practice, no published source", mentioned: /common practice/ },
  D3b: { text: "EPA Section 608 technician certification", mentioned: /Section 608/ },
  D4: { text: "Reshniak et al., Energies 16:6499 (2023)", mentioned: /Reshniak/ },
  P1: { text: "Cheng et al., ES&T 45:4016 (2011)", mentioned: /Cheng/ },
  P2: { text: "Jayjock Associates (2013), near-field diffusion", mentioned: /Jayjock/ },
  P3: { text: "Ott, Exposure Analysis (2007), ch. 18", mentioned: /Ott/ },
  P4: { text: "“Airborne infection in a fully air-conditioned hospital III”", mentioned: /hospital/ },
};

/**
 * The neutral marker for a value or rule the product applies without having confirmed it in the rule
 * text ("[M]"): screens link it to the list of readings on the rule-profile page, where the owner
 * accepts or changes each one (docs/decisions/0044-readings-and-research-notes.md).
 */
export const UNCONFIRMED = "reading";
/** Where a reader finds every reading of the company's profile, in plain words. */
export const READINGS_PATH = "/settings#readings";
export const DERIVED = "derived from the cited values";

/** A clause that already cites a rule section ("40 CFR 82.157: …") needs no summary's citation after it. */
const NAMES_A_RULE = /^40 CFR \d+\.\d+/;
const TAG = /\s*\[(S:[A-Za-z0-9,]+|M|D)\]:?/g;
const SECTION_ONLY = /^(8[24])\.(\d{3})/;

/**
 * One source text for people: each tag becomes its citation (unless the text already names it),
 * "[M]" becomes the marker "reading" and "[D]" "derived from the cited values".
 * Texts without tags (a company's own "company policy, 2026 audit") come back unchanged.
 */
// Pointers into our own reference file are internal: the tag beside them says how sure we are.
const INTERNAL = /\s*(?:docs\/reference\/)?standards\.md(\s*§\d+(,\s*§\d+)*)?|\s+§\d+\b(?=\s*$)/g;

export function readableSource(source: string): string {
  // The closing disclaimer names its codes in its own text: nothing more to cite.
  if (/standards\.md §8 disclaimer/.test(source)) return "";
  // Research notes ("from memory", "verify in …") are for us; the tag already says how sure we are.
  source = source.replace(INTERNAL, "").replace(/,?\s*\b(from memory|verify in [^;,)]*)/gi, "");
  if (!source.includes("[")) return source.trim();
  const said = new Set<string>();
  const segments = splitOutsideParens(source).map((segment) => {
    const tags = [...segment.matchAll(TAG)].map((m) => m[1]);
    let rest = segment
      .replace(TAG, "")
      .replace(/\s+([,.)])/g, "$1")
      .replace(/\(\s*\)/g, "")
      .trim();
    if (/^\([^()]*\)$/.test(rest)) rest = rest.slice(1, -1); // "(critical point 31.0 °C)" left after a stripped pointer
    if (tags.length === 0) return rest;
    // "[S:R4] 84.106" names a section of the tagged part: "40 CFR 84.106".
    if (SECTION_ONLY.test(rest)) rest = `40 CFR ${rest}`;
    const notes: string[] = [];
    for (const tag of tags) {
      if (tag === "M") notes.push(UNCONFIRMED);
      else if (tag === "D") notes.push(DERIVED);
      else
        for (const id of tag.slice(2).split(",")) {
          const c = CITATIONS[id];
          if (!c) notes.push(`source ${id}`);
          else if (!c.mentioned.test(source.replace(TAG, "")) && !NAMES_A_RULE.test(rest) && !said.has(c.text))
            notes.push(c.text);
          if (c) said.add(c.text);
        }
    }
    // "40 CFR 82 subpart F" is said again by "40 CFR 82 subpart F and 84 subpart C": cite the wider once.
    const unique = [...new Set(notes)].filter((n, _, all) => !all.some((o) => o.startsWith(`${n} and `)));
    if (!rest) return unique.join("; ");
    // "definition [S:R8]": a one-word lead-in reads "definition: 40 CFR 82.152, …".
    if (!/\s/.test(rest) && unique.length && tags.every((t) => t.startsWith("S:")))
      return `${rest}: ${unique.join("; ")}`;
    return unique.length ? `${rest} (${unique.join("; ")})` : rest;
  });
  return segments.filter(Boolean).join("; ");
}

/** "a; b (c; d)" → ["a", "b (c; d)"]: a semicolon inside brackets belongs to its clause. */
function splitOutsideParens(text: string): string[] {
  const out: string[] = [];
  let depth = 0;
  let start = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "(") depth++;
    else if (ch === ")") depth = Math.max(0, depth - 1);
    else if (ch === ";" && depth === 0) {
      out.push(text.slice(start, i));
      start = i + 1;
    }
  }
  out.push(text.slice(start));
  return out.map((x) => x.trim());
}

/** Every `source` string in a nested value made readable (used when a built-in profile is copied for a company). */
export function withReadableSources<T>(node: T): T {
  if (Array.isArray(node)) return node.map(withReadableSources) as T;
  if (node === null || typeof node !== "object") return node;
  return Object.fromEntries(
    Object.entries(node as Record<string, unknown>).map(([k, v]) => [
      k,
      k === "source" && typeof v === "string" ? readableSource(v) : withReadableSources(v),
    ]),
  ) as T;
}
